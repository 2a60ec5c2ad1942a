// The reference page's reading of the OpenAPI document: each operation with its parameters, the
// fields of its body (flattened to dotted paths, the way `fields` in a failure names them), its
// examples and answers. Built from the served document itself, so the page and the JSON never differ.
import { openApiDocument } from './document';

type Json = Record<string, unknown>;
export type FieldRow = { name: string; type: string; required: boolean; notes: string };
export type ExampleView = { name: string; summary: string; request: string | null; params: Record<string, string>; status: number; answer: string };
export type OperationView = {
	id: string;
	method: string;
	path: string;
	tag: string;
	summary: string;
	description: string;
	access: string;
	params: FieldRow[];
	body: FieldRow[];
	answers: { status: string; description: string; schema: string }[];
	examples: ExampleView[];
};

// Read as plain JSON: a shallow copy turns the document's interface into an indexable object.
const doc = (): Json => ({ ...openApiDocument() });

function resolve(schema: Json): Json {
	const ref = schema.$ref;
	if (typeof ref !== 'string') return schema;
	const name = ref.replace('#/components/schemas/', '');
	return ((doc().components as Json).schemas as Json)[name] as Json;
}

function typeOf(s: Json): string {
	if (s.$ref) return String(s.$ref).replace('#/components/schemas/', '');
	if (s.enum) return (s.enum as unknown[]).map((v) => JSON.stringify(v)).join(' | ');
	if (s.const !== undefined) return JSON.stringify(s.const);
	if (s.anyOf) return (s.anyOf as Json[]).map(typeOf).join(' or ');
	const t = Array.isArray(s.type) ? (s.type as string[]).join(' or ') : String(s.type ?? 'any');
	if (s.type === 'array' && s.items) return `array of ${typeOf(s.items as Json)}`;
	return t;
}

function notes(s: Json): string {
	const out: string[] = [];
	if (typeof s.description === 'string') out.push(s.description);
	if (s.minimum !== undefined || s.maximum !== undefined) out.push(`${s.minimum ?? '…'} to ${s.maximum ?? '…'}`);
	if (s.exclusiveMinimum !== undefined) out.push(`more than ${s.exclusiveMinimum}`);
	if (s.maxLength !== undefined) out.push(`up to ${s.maxLength} characters`);
	if (s.minItems !== undefined || s.maxItems !== undefined) out.push(`${s.minItems ?? 0} to ${s.maxItems ?? 'any'} items`);
	if (s.pattern) out.push(`pattern ${s.pattern}`);
	if (s.default !== undefined && typeof s.default !== 'object') out.push(`default ${JSON.stringify(s.default)}`);
	return out.join('; ');
}

/** The fields of a body schema, objects opened to dotted paths (arrays as `items.0.`), two levels deep. */
export function fieldRows(schema: Json, prefix = '', depth = 0): FieldRow[] {
	const s = resolve(schema);
	const props = s.properties as Record<string, Json> | undefined;
	if (!props) return [];
	const required = new Set((s.required as string[]) ?? []);
	return Object.entries(props).flatMap(([key, raw]) => {
		const name = `${prefix}${key}`;
		const p = resolve(raw);
		const row = { name, type: typeOf(raw), required: required.has(key), notes: notes(p) };
		if (depth >= 2) return [row];
		if (p.type === 'object' && p.properties) return [{ ...row, type: 'object' }, ...fieldRows(p, `${name}.`, depth + 1)];
		const items = p.type === 'array' && p.items ? resolve(p.items as Json) : null;
		if (items?.properties) return [{ ...row, type: 'array of objects' }, ...fieldRows(items, `${name}.0.`, depth + 1)];
		return [row];
	});
}

const pretty = (v: unknown) => JSON.stringify(v, null, 2);

export function referenceView(): { title: string; description: string; operations: OperationView[]; failure: FieldRow[] } {
	const d = doc();
	const info = d.info as Json;
	const operations: OperationView[] = [];
	for (const [path, item] of Object.entries(d.paths as Record<string, Json>)) {
		for (const [method, raw] of Object.entries(item)) {
			const op = raw as Json;
			const params = ((op.parameters as Json[]) ?? []).map((p) => ({ name: `${p.name} (${p.in})`, type: typeOf(p.schema as Json), required: Boolean(p.required), notes: notes({ ...(p.schema as Json), description: p.description }) }));
			const body = (op.requestBody as Json | undefined)?.content as Record<string, Json> | undefined;
			const media = body?.['application/json'];
			const responses = op.responses as Record<string, Json>;
			const examples: ExampleView[] = [];
			for (const [status, r] of Object.entries(responses)) {
				const found = (((r.content as Record<string, Json>)?.['application/json']?.examples as Record<string, Json>) ?? {}) as Record<string, Json>;
				for (const [name, e] of Object.entries(found)) {
					const request = (media?.examples as Record<string, Json> | undefined)?.[name]?.value;
					const values = Object.fromEntries(((op.parameters as Json[]) ?? []).flatMap((p) => {
						const v = ((p.examples as Record<string, Json> | undefined)?.[name]?.value ?? undefined) as string | undefined;
						return v === undefined ? [] : [[String(p.name), v]];
					}));
					examples.push({ name, summary: String(e.summary ?? name), request: request === undefined ? null : pretty(request), params: values, status: Number(status), answer: pretty(e.value) });
				}
			}
			const roles = op['x-roles'] as string[] | undefined;
			const security = op.security as Json[] | undefined;
			const access = roles
				? `Session cookie of a signed-in ${roles.join(' or ')}.`
				: security?.some((s) => 'providerSignature' in s)
					? 'The payment provider only: its signature header is required.'
					: security?.some((s) => 'session' in s)
						? 'Public with the order link’s token, or with the session of the shopper who placed it (or the owner).'
						: 'Public.';
			operations.push({
				id: String(op.operationId),
				method: method.toUpperCase(),
				path,
				tag: ((op.tags as string[]) ?? [''])[0],
				summary: String(op.summary ?? ''),
				description: String(op.description ?? ''),
				access,
				params,
				body: media ? fieldRows(media.schema as Json) : [],
				answers: Object.entries(responses).map(([status, r]) => {
					const schema = ((r.content as Record<string, Json>)?.['application/json']?.schema ?? {}) as Json;
					return { status, description: String(r.description ?? ''), schema: typeOf(schema) };
				}),
				examples: examples.sort((a, b) => a.status - b.status)
			});
		}
	}
	const failure = fieldRows({ $ref: '#/components/schemas/Failure' });
	return { title: String(info.title), description: String(info.description), operations, failure };
}
