// Where the system under test runs: tests/run.js starts it and passes the addresses here.
function need(name: string) {
	const v = process.env[name];
	if (!v) throw new Error(`${name} is not set: run the tests with npm test, which starts the app, the fakes and MariaDB.`);
	return v;
}

export const testEnv = {
	get appUrl() {
		return need('APP_URL');
	},
	get databaseUrl() {
		return need('DATABASE_URL');
	},
	get mailUrl() {
		return need('MAIL_URL');
	},
	get paymentsUrl() {
		return need('PAYMENTS_URL');
	},
	get dbSocket() {
		return need('DB_SOCKET');
	},
	get webhookSecret() {
		return need('STRIPE_WEBHOOK_SECRET');
	},
	get stripeKey() {
		return need('STRIPE_SECRET_KEY');
	}
};
