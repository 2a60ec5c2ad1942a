// The configure page's two live sources: the engine drafting and drawing in the browser on every change
// (loaded after first paint, its own chunk), and the server's quote (price, metres, stock, ship date),
// asked for debounced, a newer request cancelling the one still in flight.
import { optionsOfForm, skirtRequestOf, type MakeForm } from '$lib/forms/make';
import type { Preview, PreviewInput } from '$lib/drafting/preview';
import type { HouseRules } from '$lib/drafting/rules';
import type { StyleId } from '$lib/drafting/options';
import type { QuoteAnswer } from '$lib/api/answers';
import type { ConfirmAsk } from '$lib/forms/confirm';

type Fabric = { id: number; name: string; colour: string; swatchHex: string; imageUrl: string | null };
type Engine = typeof import('$lib/drafting/preview');

const round1 = (n: number) => Math.round(n * 10) / 10;

/** What she has typed, in cm, to the millimetre as the server keeps it; null where she has not. */
export function typedCm(form: MakeForm) {
	const f = form as MakeForm & { waistToKnee?: number | null };
	const cm = (v: number | null | undefined) => (typeof v === 'number' && Number.isFinite(v) ? round1(form.units === 'in' ? v * 2.54 : v) : null);
	return { waist: cm(f.waist), hip: cm(f.hip), length: cm(f.length), waistToHip: f.unknownDepth ? null : cm(f.waistToHip), waistToKnee: cm(f.waistToKnee) };
}

export class LiveSkirt {
	engine = $state<Engine | null>(null);
	/** The newest drawing that drafted; kept while a figure being typed does not. */
	last = $state<Extract<Preview, { ok: true }> | null>(null);
	problems = $state<string[]>([]);

	/** Loads the engine once the page has painted (two frames, then idle time if the browser offers it). */
	load() {
		const go = () => import('$lib/drafting/preview').then((e) => (this.engine = e));
		requestAnimationFrame(() => requestAnimationFrame(() => ('requestIdleCallback' in window ? requestIdleCallback(go, { timeout: 300 }) : setTimeout(go, 0))));
	}

	/** Drafts and draws; each run is measured for the bench (performance entry "ql:draft+drawing"). */
	run(input: PreviewInput) {
		const engine = this.engine;
		if (!engine) return;
		const start = performance.now();
		const p = engine.preview(input);
		performance.measure('ql:draft+drawing', { start, end: performance.now() });
		if (p.ok) {
			this.last = p;
			this.problems = [];
		} else this.problems = p.problems.map((x) => x.message);
	}
}

export function previewInput(style: StyleId, form: MakeForm, rules: HouseRules, fabric: Fabric | undefined, pieces: boolean): PreviewInput {
	return {
		style,
		measurements: typedCm(form),
		options: optionsOfForm(form),
		rules,
		cloth: fabric ? { colour: fabric.swatchHex, image: fabric.imageUrl, name: `${fabric.name.toLowerCase()}, ${fabric.colour.toLowerCase()}` } : undefined,
		units: form.units,
		pieces,
		id: 'live'
	};
}

export class LiveQuote {
	quote = $state<QuoteAnswer | null>(null);
	problem = $state<string | null>(null);
	/** A figure outside what a block fits: asked, never silently drafted ("did you mean …?"). */
	confirmAsk = $state<ConfirmAsk | null>(null);
	loading = $state(false);

	/** Call from an effect with the request body; returns the effect's cleanup. */
	ask(body: string) {
		const controller = new AbortController();
		const timer = setTimeout(async () => {
			this.loading = true;
			try {
				const res = await fetch('/api/quote', { method: 'POST', headers: { 'content-type': 'application/json' }, body, signal: controller.signal });
				const json = await res.json();
				if (res.ok) {
					this.quote = json;
					this.problem = null;
					this.confirmAsk = null;
				} else if (json.confirm) {
					this.confirmAsk = json.confirm;
					this.problem = null;
					this.quote = null;
				} else {
					this.confirmAsk = null;
					this.problem = ((Object.values(json.fields ?? {}).flat()[0] as string) ?? json.message) || 'Some values need a second look.';
				}
			} catch (err) {
				if ((err as Error).name !== 'AbortError') this.problem = 'We could not reach the atelier just now; your price will come back when the connection does.';
			} finally {
				if (!controller.signal.aborted) this.loading = false;
			}
		}, 350);
		return () => {
			clearTimeout(timer);
			controller.abort();
		};
	}
}

/** The quote request: only what the server alone can answer needs it, so it is sent once the form is whole. */
export const quoteRequest = (style: string, form: MakeForm) => JSON.stringify(skirtRequestOf(style, form));
