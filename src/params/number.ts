import type { ParamMatcher } from '@sveltejs/kit';

// An order number as the shop makes them: "QL-" and digits.
export const match: ParamMatcher = (param) => /^QL-\d{1,10}$/.test(param);
