import { json } from '@sveltejs/kit';
import { openApiDocument } from '$lib/server/api/document';
import type { RequestHandler } from './$types';

// Public and the same for everyone: it describes the routes, never their data. Shared caches may
// keep it for an hour; a new release changes it.
export const GET: RequestHandler = () => json(openApiDocument(), { headers: { 'cache-control': 'public, max-age=3600' } });
