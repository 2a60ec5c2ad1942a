// @ts-check
// The provider's list shape for GET /v1/checkout/sessions and GET /v1/refunds: newest first,
// `limit` 1–100 (default 10), cursors `starting_after` / `ending_before`, `has_more`, and the
// filters each list documents; any other parameter (expand included: lists here do not expand) is
// refused as the provider refuses an unknown one.
import { ApiError, invalid, noSuch } from './errors.js';

/** @typedef {Record<string, any>} Obj */

/**
 * @param {Obj[]} newestFirst every object of the kind, newest first
 * @param {Obj} params query parameters (form-decoded)
 * @param {{ kind: string, url: string, filters: Record<string, (o: Obj, value: any) => boolean> }} spec
 */
export function listPage(newestFirst, params, { kind, url, filters }) {
	for (const key of Object.keys(params)) {
		if (!['limit', 'starting_after', 'ending_before', ...Object.keys(filters)].includes(key)) {
			throw invalid(key, `Received unknown parameter: ${key}`);
		}
	}
	let limit = 10;
	if (params.limit !== undefined) {
		if (
			typeof params.limit !== 'string' ||
			!/^\d+$/.test(params.limit) ||
			Number(params.limit) < 1 ||
			Number(params.limit) > 100
		) {
			throw new ApiError(400, 'parameter_invalid_integer', 'Invalid limit: must be an integer from 1 to 100.', {
				param: 'limit'
			});
		}
		limit = Number(params.limit);
	}
	if (params.starting_after !== undefined && params.ending_before !== undefined) {
		throw invalid('ending_before', 'You may only specify one of these parameters: ending_before, starting_after.');
	}
	let items = newestFirst;
	for (const [name, test] of Object.entries(filters)) {
		if (params[name] !== undefined) items = items.filter((o) => test(o, params[name]));
	}
	/** @param {string} param */
	const at = (param) => {
		const id = params[param];
		const i = items.findIndex((o) => o.id === id);
		if (i < 0) throw noSuch(kind, String(id), param);
		return i;
	};
	let data;
	let hasMore;
	if (params.ending_before !== undefined) {
		const before = items.slice(0, at('ending_before'));
		data = before.slice(-limit);
		hasMore = before.length > limit;
	} else {
		const from = params.starting_after !== undefined ? at('starting_after') + 1 : 0;
		data = items.slice(from, from + limit);
		hasMore = items.length > from + limit;
	}
	return { object: 'list', data: data.map((o) => structuredClone(o)), has_more: hasMore, url };
}
