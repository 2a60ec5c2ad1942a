import type { ParamMatcher } from '@sveltejs/kit';

// A style's slug, in the shape the catalogue form allows.
export const match: ParamMatcher = (param) => /^[a-z0-9]+(?:-[a-z0-9]+)*$/.test(param) && param.length <= 80;
