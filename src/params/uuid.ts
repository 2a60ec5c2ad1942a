import type { ParamMatcher } from '@sveltejs/kit';

// A person's id (Auth.js makes them with crypto.randomUUID()).
export const match: ParamMatcher = (param) => /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/.test(param);
