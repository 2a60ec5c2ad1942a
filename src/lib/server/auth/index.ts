import { SvelteKitAuth, CredentialsSignin } from '@auth/sveltekit';
import Credentials from '@auth/sveltekit/providers/credentials';
import Nodemailer from '@auth/sveltekit/providers/nodemailer';
import { DrizzleAdapter } from '@auth/drizzle-adapter';
import { eq } from 'drizzle-orm';
import { env } from '$env/dynamic/private';
import { db } from '../db';
import { accounts, sessions, users, verificationTokens } from '../db/schema';
import { sendMail } from '../mail';
import { signInLinkMail } from '../mail/templates';
import { checkPassword, normaliseEmail } from './password';

class ThrottledSignIn extends CredentialsSignin {
	code = 'throttled';
}
class DisabledSignIn extends CredentialsSignin {
	code = 'disabled';
}

export const { handle: authHandle, signIn, signOut } = SvelteKitAuth({
	adapter: DrizzleAdapter(db, {
		usersTable: users,
		accountsTable: accounts,
		sessionsTable: sessions,
		verificationTokensTable: verificationTokens
	}),
	// Credentials sign-in needs JWT sessions; the role is read fresh from the database on every
	// request (see hooks), so a role change or a disabled account takes effect at once.
	session: { strategy: 'jwt', maxAge: 30 * 24 * 60 * 60 },
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
				const result = await checkPassword(db, email, password);
				if (result.ok) return { id: result.user.id, email: result.user.email, name: result.user.name };
				if (result.reason === 'throttled') throw new ThrottledSignIn();
				if (result.reason === 'disabled') throw new DisabledSignIn();
				return null;
			}
		}),
		Nodemailer({
			id: 'nodemailer',
			server: { host: env.SMTP_HOST ?? '127.0.0.1', port: Number(env.SMTP_PORT ?? 2525) },
			from: env.MAIL_FROM ?? 'Atelier Ondine <atelier@ondine.example>',
			maxAge: 60 * 60,
			normalizeIdentifier: normaliseEmail,
			async sendVerificationRequest({ identifier, url }) {
				await sendMail({ to: identifier, ...signInLinkMail(url) });
			}
		})
	],
	callbacks: {
		async signIn({ user }) {
			if (!user?.email) return false;
			const [row] = await db.select({ disabledAt: users.disabledAt }).from(users).where(eq(users.email, normaliseEmail(user.email))).limit(1);
			return !row?.disabledAt;
		},
		jwt({ token, user }) {
			if (user?.id) token.sub = user.id;
			return token;
		},
		session({ session, token }) {
			if (token.sub) session.user.id = token.sub;
			return session;
		}
	}
});
