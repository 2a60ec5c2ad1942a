import type { ParamMatcher } from '@sveltejs/kit';

// A database id: a positive integer that fits MariaDB's signed INT. Anything else ("abc", "NaN", a
// 30-digit number) matches no route, so it answers 404 instead of reaching a query.
export const match: ParamMatcher = (param) => /^[1-9]\d{0,9}$/.test(param) && Number(param) <= 2_147_483_647;
