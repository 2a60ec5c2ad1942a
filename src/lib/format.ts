// Display helpers shared by the shop, the workroom and the back office.
export function formatMoney(minor: number, currency = 'EUR', locale = 'en-IE') {
	return new Intl.NumberFormat(locale, { style: 'currency', currency }).format(minor / 100);
}

export function formatDate(value: string | Date | null | undefined, locale = 'en-GB') {
	if (!value) return '—';
	const d = typeof value === 'string' ? new Date(value.length === 10 ? `${value}T12:00:00Z` : value) : value;
	return new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' }).format(d);
}

export function formatMetres(cm: number) {
	return `${(cm / 100).toFixed(2)} m`;
}
