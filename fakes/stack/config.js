// @ts-check
// Safe local defaults for every setting; .env.example lists the same names. Anything set in the
// environment wins, so a real deployment overrides each of them.
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { ROOT } from './bootstrap.js';

/** Reads KEY=value lines from .env if there is one (no package needed for that). */
function readDotEnv() {
	const file = join(ROOT, '.env');
	if (!existsSync(file)) return {};
	/** @type {Record<string, string>} */
	const out = {};
	for (const line of readFileSync(file, 'utf8').split('\n')) {
		const m = line.match(/^\s*([A-Z0-9_]+)\s*=\s*(.*?)\s*$/);
		if (m) out[m[1]] = m[2].replace(/^(['"])(.*)\1$/, '$2');
	}
	return out;
}

export function localConfig() {
	const env = { ...readDotEnv(), ...process.env };
	const port = Number(env.PORT ?? 3000);
	return {
		dbPort: Number(env.QL_DB_PORT ?? 3307),
		dbDataDir: env.QL_DB_DATA_DIR ?? join(ROOT, '.data', 'mariadb'),
		db: {
			user: env.QL_DB_USER ?? 'quarterline',
			password: env.QL_DB_PASSWORD ?? 'quarterline-local',
			database: env.QL_DB_NAME ?? 'quarterline'
		},
		appPort: port,
		origin: env.ORIGIN ?? `http://127.0.0.1:${port}`,
		paymentsPort: Number(env.PAYMENTS_PORT ?? 4242),
		smtpPort: Number(env.SMTP_PORT ?? 2525),
		mailWebPort: Number(env.MAIL_WEB_PORT ?? 8025),
		authSecret: env.AUTH_SECRET ?? 'quarterline-local-only-secret-change-me-in-production',
		stripeKey: env.STRIPE_SECRET_KEY ?? 'sk_test_quarterline_local',
		webhookSecret: env.STRIPE_WEBHOOK_SECRET ?? 'whsec_quarterline_local',
		uploadDir: env.UPLOAD_DIR ?? join(ROOT, '.data', 'uploads')
	};
}

/**
 * The environment the app process gets.
 * @param {ReturnType<typeof localConfig>} c
 * @param {string} databaseUrl
 */
export function appEnv(c, databaseUrl) {
	return {
		DATABASE_URL: databaseUrl,
		HOST: '127.0.0.1',
		PORT: String(c.appPort),
		ORIGIN: c.origin,
		AUTH_SECRET: c.authSecret,
		AUTH_TRUST_HOST: 'true',
		STRIPE_SECRET_KEY: c.stripeKey,
		STRIPE_WEBHOOK_SECRET: c.webhookSecret,
		STRIPE_API_HOST: '127.0.0.1',
		STRIPE_API_PORT: String(c.paymentsPort),
		STRIPE_API_PROTOCOL: 'http',
		SMTP_HOST: '127.0.0.1',
		SMTP_PORT: String(c.smtpPort),
		UPLOAD_DIR: c.uploadDir,
		// A fit photo is up to 10 MB, sent one to a request (the largest body the shop takes); swatches are 5 MB.
		BODY_SIZE_LIMIT: '11M'
	};
}
