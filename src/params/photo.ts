import type { ParamMatcher } from '@sveltejs/kit';

// A fit photo's address: 32 random bytes in base64url (43 characters), made by the server only.
export const match: ParamMatcher = (param) => /^[A-Za-z0-9_-]{43}$/.test(param);
