// Display helpers shared by the shop, the workroom, the back office, the mails and the files.

// Money is kept in the currency's minor units (cents; none for a zero-decimal currency such as JPY), as
// the payment provider counts it. The shop's currency is a setting (shop_setting "currency"), so every
// amount shown goes through these with that currency, never a typed symbol.
const LOCALE = 'en-IE';
const formats = new Map<string, Intl.NumberFormat>();

function moneyFormat(currency: string, locale = LOCALE) {
	const key = `${locale}|${currency}`;
	let f = formats.get(key);
	if (!f) formats.set(key, (f = new Intl.NumberFormat(locale, { style: 'currency', currency })));
	return f;
}

/** How many minor units make one of the currency (2 for EUR and USD, 0 for JPY), as Intl knows it. */
export function minorDigits(currency: string): number {
	return moneyFormat(currency).resolvedOptions().maximumFractionDigits ?? 2;
}

/** An amount in minor units, written for a person: "€12.50", "US$12.50", "JP¥1,250". */
export function formatMoney(minor: number, currency: string, locale = LOCALE) {
	return moneyFormat(currency, locale).format(minor / 10 ** minorDigits(currency));
}

/** The currency's sign as the shop writes it beside a field: "€", "US$", "£". */
export function currencySign(currency: string, locale = LOCALE) {
	return moneyFormat(currency, locale).formatToParts(0).find((p) => p.type === 'currency')?.value ?? currency;
}

/** An amount in minor units as a plain decimal for a form field or a spreadsheet: "12.50". */
export function plainAmount(minor: number, currency: string) {
	return (minor / 10 ** minorDigits(currency)).toFixed(minorDigits(currency));
}

/** A typed amount ("12.5") in minor units (1250), rounded to the currency's smallest unit. */
export function toMinor(amount: number, currency: string) {
	return Math.round(amount * 10 ** minorDigits(currency));
}

export function formatDate(value: string | Date | null | undefined, locale = 'en-GB') {
	if (!value) return '—';
	const d = typeof value === 'string' ? new Date(value.length === 10 ? `${value}T12:00:00Z` : value) : value;
	return new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' }).format(d);
}

export function formatMetres(cm: number) {
	return `${(cm / 100).toFixed(2)} m`;
}
