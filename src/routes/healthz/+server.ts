import { json } from '@sveltejs/kit';

// Answers without touching the database: the load balancer's "is the process up" check, and the
// floor the benchmark measures the quote API against.
export const GET = () => json({ ok: true });
