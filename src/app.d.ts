import type { Role } from '$lib/server/db/schema';

declare global {
	namespace App {
		interface Error {
			message: string;
		}
		interface Locals {
			user: { id: string; email: string; name: string; role: Role } | null;
		}
		interface PageData {
			user?: { name: string; role: Role } | null;
			/** The shop's currency (ISO 4217), from the root layout: every amount is written in it. */
			currency: string;
		}
	}
}

declare module '@auth/core/types' {
	interface Session {
		user: { id: string; email: string; name?: string | null };
		/** users.sessionVersion when this session began (-1 for cookies from before it was kept). */
		sessionVersion: number;
	}
}

declare module '@auth/core/jwt' {
	interface JWT {
		sessionVersion?: number;
	}
}

export {};
