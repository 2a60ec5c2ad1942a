import { orderToken } from '../order/link';
import { siteUrl } from '../origin';

/** A signed link for her mail, from the configured origin: the order page, or one of its pages. */
export function fitLink(number: string, page: '' | '/fit') {
	return siteUrl(`/orders/${encodeURIComponent(number)}${page}?t=${orderToken(number)}`);
}
