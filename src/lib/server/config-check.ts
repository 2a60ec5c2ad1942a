// Secrets anyone can read must not run a real shop: with the example AUTH_SECRET anyone can mint an
// owner's session cookie and order links, with the example webhook secret anyone can sign payment
// events. The published values are read from the files that publish them, at build time, so the list
// cannot fall behind them.
import envExample from '../../../.env.example?raw';
import stackConfig from '../../../fakes/stack/config.js?raw';

type Env = Record<string, string | undefined>;

const SECRET_NAME = /SECRET|PASSWORD|DATABASE_URL/;

/** Every secret value .env.example and the local stack's defaults publish. */
export function publishedSecrets(): Set<string> {
	const found = new Set<string>();
	const add = (name: string, value: string) => {
		if (!SECRET_NAME.test(name) || !value) return;
		found.add(value);
		if (name === 'DATABASE_URL') {
			const password = dbPassword(value);
			if (password) found.add(password);
		}
	};
	for (const m of envExample.matchAll(/^([A-Z0-9_]+)=(.*)$/gm)) add(m[1], m[2].trim());
	for (const m of stackConfig.matchAll(/env\.([A-Z0-9_]+) \?\? '([^']*)'/g)) add(m[1], m[2]);
	return found;
}

function dbPassword(url: string): string {
	try {
		return decodeURIComponent(new URL(url).password);
	} catch {
		return '';
	}
}

const LOOPBACK = /^(localhost|127(\.\d{1,3}){3}|\[::1\])$/;

/** Why this counts as a real deployment, or null for local use (npm start, npm test). */
export function deploymentReason(env: Env): string | null {
	if (env.NODE_ENV === 'production') return 'NODE_ENV is production';
	if (env.ORIGIN) {
		try {
			if (!LOOPBACK.test(new URL(env.ORIGIN).hostname)) return `ORIGIN (${env.ORIGIN}) is not this machine`;
		} catch {
			return 'ORIGIN is not a URL';
		}
	}
	return null;
}

// Minimum lengths: 32 characters for the session secret (what `openssl rand -base64 32` gives is 44),
// 24 for the webhook secret (the provider's are longer), 16 for the database password (common practice).
const RULES = [
	{
		name: 'AUTH_SECRET',
		min: 32,
		value: (env: Env) => env.AUTH_SECRET ?? '',
		hint: 'a long random value of your own, e.g. from `openssl rand -base64 32`'
	},
	{
		name: 'STRIPE_WEBHOOK_SECRET',
		min: 24,
		value: (env: Env) => env.STRIPE_WEBHOOK_SECRET ?? '',
		hint: 'the signing secret the payment provider shows for your webhook endpoint'
	},
	{
		name: 'DATABASE_URL',
		min: 16,
		value: (env: Env) => dbPassword(env.DATABASE_URL ?? ''),
		hint: 'a database user whose password is long and your own',
		what: 'the database password in it'
	}
];

/** The problems that stop a real deployment from starting, each naming its setting; empty when fine. */
export function configProblems(env: Env, published = publishedSecrets()): string[] {
	if (!deploymentReason(env)) return [];
	const problems: string[] = [];
	if (!env.ORIGIN)
		problems.push('ORIGIN is not set: links in mail need the shop’s public address, e.g. https://shop.example.');
	for (const rule of RULES) {
		const value = rule.value(env);
		const what = `${rule.name}${rule.what ? ` (${rule.what})` : ''}`;
		const why = !value
			? 'is missing'
			: published.has(value)
				? 'is one of the published examples (.env.example, fakes/stack/)'
				: value.length < rule.min
					? `is shorter than ${rule.min} characters`
					: null;
		if (why) problems.push(`${what} ${why}: use ${rule.hint}.`);
	}
	return problems;
}

export function configMessage(env: Env, problems: string[]) {
	return [
		`Quarterline will not start: ${deploymentReason(env)}, so this is taken for a real deployment, and these settings are not safe:`,
		...problems.map((p) => `  - ${p}`),
		'For local use, leave NODE_ENV unset and keep ORIGIN on 127.0.0.1 or localhost (npm start does both).'
	].join('\n');
}
