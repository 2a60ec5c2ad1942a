import { SvelteKitAuth, CredentialsSignin } from '@auth/sveltekit';
import Credentials from '@auth/sveltekit/providers/credentials';
import Nodemailer from '@auth/sveltekit/providers/nodemailer';
import { DrizzleAdapter } from '@auth/drizzle-adapter';
import { eq } from 'drizzle-orm';
import { env } from '$env/dynamic/private';
import { normaliseEmail } from '$lib/email';
import { db } from '../db';
import { accounts, sessions, users, verificationTokens } from '../db/schema';
import { sendMail } from '../mail';
import { signInLinkMail } from '../mail/templates';
import { safeNext, siteUrl } from '../origin';
import { signInContext } from './context';
import { checkPassword } from './password';

class ThrottledSignIn extends CredentialsSignin {
	code = 'throttled';
}
class ClientThrottledSignIn extends CredentialsSignin {
	code = 'client-throttled';
}
class DisabledSignIn extends CredentialsSignin {
	code = 'disabled';
}

const adapterTables = {
	usersTable: users,
	accountsTable: accounts,
	sessionsTable: sessions,
	verificationTokensTable: verificationTokens
};

export const {
	handle: authHandle,
	signIn,
	signOut
} = SvelteKitAuth({
	adapter: DrizzleAdapter(db, adapterTables),
	// Credentials sign-in needs JWT sessions; the role is read fresh from the database on every
	// request (see hooks), so a role change or a disabled account takes effect at once.
	session: { strategy: 'jwt', maxAge: 30 * 24 * 60 * 60 },
	// Auth.js builds its own URLs from the request's Host header; hooks/origin.ts sets that header from
	// ORIGIN before Auth.js sees the request, so "trusting the host" means trusting our setting.
	trustHost: true,
	secret: env.AUTH_SECRET,
	basePath: '/auth',
	pages: { signIn: '/signin', verifyRequest: '/signin/check-mail', error: '/signin' },
	providers: [
		Credentials({
			credentials: { email: { type: 'email' }, password: { type: 'password' } },
			async authorize(credentials) {
				const email = typeof credentials.email === 'string' ? credentials.email : '';
				const password = typeof credentials.password === 'string' ? credentials.password : '';
				if (!email || !password) return null;
				const context = signInContext();
				const result = await checkPassword(db, email, password, context?.client ?? null);
				if (result.ok) return { id: result.user.id, email: result.user.email, name: result.user.name };
				if (result.reason === 'throttled' || result.reason === 'client-throttled') {
					if (context) Object.assign(context, { refused: result.reason, retryAfter: result.retryAfter });
					throw result.reason === 'throttled' ? new ThrottledSignIn() : new ClientThrottledSignIn();
				}
				if (result.reason === 'disabled') throw new DisabledSignIn();
				return null;
			}
		}),
		Nodemailer({
			id: 'nodemailer',
			server: { host: env.SMTP_HOST ?? '127.0.0.1', port: Number(env.SMTP_PORT ?? 2525) },
			from: env.MAIL_FROM ?? 'Atelier Ondine <atelier@ondine.example>',
			maxAge: 60 * 60,
			// An address we cannot deliver to is passed on as typed; the signIn callback below refuses it
			// before any token is made or mail sent.
			normalizeIdentifier: (raw) => normaliseEmail(raw) ?? String(raw ?? ''),
			async sendVerificationRequest({ identifier, url }) {
				// Rebuilt on ORIGIN: the host in `url` came from a request, and mail must only link to the shop.
				const link = new URL(siteUrl(url));
				const callback = link.searchParams.get('callbackUrl');
				link.searchParams.set('callbackUrl', siteUrl(safeNext(callback, '/account')));
				await sendMail({ to: identifier, ...signInLinkMail(link.toString()) });
			}
		})
	],
	callbacks: {
		async signIn({ user }) {
			const email = user?.email ? normaliseEmail(user.email) : null;
			if (!email || email !== user.email) return '/signin?error=Address';
			const [row] = await db
				.select({ disabledAt: users.disabledAt })
				.from(users)
				.where(eq(users.email, email))
				.limit(1);
			return !row?.disabledAt;
		},
		// Only paths on this shop, checked the way the browser will read them.
		redirect({ url }) {
			return siteUrl(safeNext(url, '/'));
		},
		async jwt({ token, user }) {
			// At sign-in the person's session version goes into the cookie; hooks/user.ts compares it on
			// every request, and sign-out, switching the account off or a new password raise it.
			if (user?.id) {
				token.sub = user.id;
				const [row] = await db.select({ v: users.sessionVersion }).from(users).where(eq(users.id, user.id)).limit(1);
				token.sessionVersion = row?.v ?? 0;
			}
			return token;
		},
		session({ session, token }) {
			if (token.sub) session.user.id = token.sub;
			session.sessionVersion = typeof token.sessionVersion === 'number' ? token.sessionVersion : -1;
			return session;
		}
	}
});
