import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { compileErrors, validate } from '@readme/openapi-parser';
import { describe, expect, it } from 'vitest';
import { quoteSchema } from '$lib/forms/quote';
import { DEMO_STYLES } from '../seed/catalogue';
import { OPERATIONS, openApiDocument } from './document';

const doc = openApiDocument();

describe('the OpenAPI document', () => {
	it('is a valid OpenAPI 3.1 document (checked by @readme/openapi-parser against the published 3.1 schema)', async () => {
		// A deep copy: the validator dereferences in place.
		const result = await validate(structuredClone(doc) as Parameters<typeof validate>[0]);
		expect(result.valid, result.valid ? '' : compileErrors(result)).toBe(true);
		expect(result.warnings).toEqual([]);
		expect(doc.openapi).toBe('3.1.0');
	});

	it('describes every JSON endpoint under src/routes/api, with each method it exports', () => {
		const root = join(process.cwd(), 'src/routes');
		const found: string[] = [];
		const walk = (dir: string) => {
			for (const f of readdirSync(dir)) {
				const p = join(dir, f);
				if (statSync(p).isDirectory()) walk(p);
				else if (f === '+server.ts') {
					const path = `/${relative(root, dir)}`.replace(/\[(\w+)(?:=\w+)?\]/g, '{$1}');
					for (const m of readFileSync(p, 'utf8').matchAll(/export const (GET|POST|PUT|PATCH|DELETE)\b/g)) found.push(`${m[1].toLowerCase()} ${path}`);
				}
			}
		};
		walk(join(root, 'api'));
		const documented = Object.entries(doc.paths ?? {}).flatMap(([path, item]) => Object.keys(item ?? {}).map((m) => `${m} ${path}`));
		// The document itself is served, not described in itself.
		expect(found.filter((f) => f !== 'get /api/openapi.json').sort()).toEqual(documented.sort());
	});

	it('takes its request schemas from the forms the endpoints validate with', () => {
		const quote = doc.components?.schemas?.QuoteRequest as { properties: Record<string, { enum?: string[]; properties?: Record<string, { enum?: string[] }> }>; required: string[] };
		const options = quoteSchema.shape.options.unwrap();
		expect(quote.properties.options.properties?.vent.enum).toEqual(options.shape.vent.unwrap().options);
		expect(quote.properties.units.enum).toEqual(['cm', 'in']);
		// Defaults make a field optional for the caller.
		expect(quote.required.sort()).toEqual(['measurements', 'style']);
	});

	it('names style slugs, not kinds, with every seeded slug as an example', () => {
		const description = doc.paths?.['/api/quote']?.post?.description ?? '';
		for (const s of DEMO_STYLES) expect(description).toContain(`\`${s.slug}\``);
		expect(description).toContain('"straight"');
	});

	for (const op of OPERATIONS) {
		describe(`${op.method.toUpperCase()} ${op.path}`, () => {
			it('has an example for every status it documents, each answer valid against the schema of its status', () => {
				const statuses = new Set(Object.values(op.examples).map((e) => e.status));
				for (const [name, e] of Object.entries(op.examples)) {
					const answer = op.answers[e.status];
					expect(answer, `${name}: status ${e.status} is not documented`).toBeDefined();
					const parsed = answer.schema.safeParse(e.answer);
					expect(parsed.success, `${name}: ${JSON.stringify(parsed.error?.issues)}`).toBe(true);
				}
				const successes = Object.keys(op.answers).map(Number).filter((s) => s < 300);
				for (const s of successes) expect(statuses, `no example answers ${s}`).toContain(s);
			});

			it('documents request examples that pass its request schema when they are meant to succeed', () => {
				if (!op.body) return;
				for (const [name, e] of Object.entries(op.examples)) {
					if (e.status >= 300 || op.operationId === 'paymentCallback') continue;
					const parsed = op.body.schema.safeParse(e.body);
					expect(parsed.success, `${name}: ${JSON.stringify(parsed.error?.issues)}`).toBe(true);
				}
			});
		});
	}
});
