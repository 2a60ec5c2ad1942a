// "Did you mean …?": a figure outside what a block fits is most often a slip of the keyboard (150 typed
// for 105) or of the tape. The engine says which figure and its limit (a confirmable FieldProblem); this
// offers the likely intended number, in the shopper's units, and otherwise the limit in words.
// Our own small heuristic (no library guesses typing slips): digits swapped, one digit dropped or doubled.
import { problemIn, type FieldProblem } from '../drafting/errors';
import { inToCm } from '../drafting/units';

/** What the shop shows for a figure the engine asks to confirm. */
export interface ConfirmAsk {
	/** The form field ("waist", "hip"). */
	field: string;
	/** The engine's sentence, in the shopper's units. */
	message: string;
	/** The figure as she typed it, and a likely intended one, both in her units (none when nothing fits). */
	value: number;
	suggestion: number | null;
}

/** Numbers one slip away from `typed`: two digits swapped, a digit dropped, a digit doubled. */
export function slipsOf(typed: number): number[] {
	const [whole, frac] = String(typed).split('.');
	const out = new Set<number>();
	const add = (w: string) => {
		if (!w || w.startsWith('0')) return;
		out.add(Number(frac ? `${w}.${frac}` : w));
	};
	for (let i = 0; i < whole.length; i++) {
		for (let j = i + 1; j < whole.length; j++) {
			const d = whole.split('');
			[d[i], d[j]] = [d[j], d[i]];
			add(d.join(''));
		}
		add(whole.slice(0, i) + whole.slice(i + 1));
		add(whole.slice(0, i + 1) + whole[i] + whole.slice(i + 1));
	}
	out.delete(typed);
	return [...out];
}

/**
 * The likely intended figure: one slip away from what she typed, inside `fits` (cm), nearest to `usual`
 * (cm, a partner figure such as the hip for a waist). Null when no slip lands inside.
 */
export function likelyFigure(typed: number, units: 'cm' | 'in', fits: (cm: number) => boolean, usual: number): number | null {
	const toCm = (v: number) => (units === 'in' ? inToCm(v) : v);
	const inside = slipsOf(typed).filter((v) => fits(toCm(v)));
	inside.sort((a, b) => Math.abs(toCm(a) - usual) - Math.abs(toCm(b) - usual));
	return inside[0] ?? null;
}

/**
 * The question for the first confirmable problem, or null. `typed` is the form's values in her units,
 * `cm` the same in centimetres.
 */
export function confirmAsk(problems: FieldProblem[], typed: { waist: number; hip: number }, cm: { waist: number; hip: number }, units: 'cm' | 'in'): ConfirmAsk | null {
	const p = problems.find((x) => x.confirmable && (x.field === 'waist' || x.field === 'hip'));
	if (!p) return null;
	const field = p.field as 'waist' | 'hip';
	const limit = p.limit ?? p.max ?? Infinity;
	// A hip over the limit is too large for the waist; a waist over the limit too large for the hip. The
	// slip must also keep the figure a real one (hip from 70, waist from 50: MEASUREMENT_LIMITS).
	const least = field === 'hip' ? Math.max(70, cm.waist) : 50;
	const usual = field === 'hip' ? cm.waist + 25 : cm.hip - 15;
	const suggestion = likelyFigure(typed[field], units, (v) => v >= least && v <= limit, usual);
	return { field, message: problemIn(p, units), value: typed[field], suggestion };
}
