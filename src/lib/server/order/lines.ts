// What an order line keeps, and the one way it is written and read back. The line stores what the
// shopper gave (in cm, exactly as drafted), the choice as the engine resolved it (style kind, options,
// the cloth's stretch), her fit adjustments, where her figures came from, the engine's figures and the
// price. A ticket, a reprint or a remake drafts the line again from this record alone, with the house
// rules version its order keeps, so a reprint never changes.
import type { Figures, FitAdjustments, Measurements, SkirtChoiceInput, StyleId } from '$lib/drafting';
import type { FigureSource } from '../db/schema';
import type { LinePricing } from '$lib/pricing';

/** The measurements snapshot, in cm (null: not given, the house default was drafted and said so). */
export interface StoredMeasurements {
	waist: number;
	hip: number;
	length: number;
	waistToHip: number | null;
	waistToKnee?: number | null;
	/** She confirmed a figure outside what a block is usually drafted for ("did you mean …?"). */
	confirmed?: boolean;
}

/** The choice as drafted: the style's kind, every option she picked, and the cloth's stretch. */
export type StoredChoice = SkirtChoiceInput & { style: StyleId; stretch: boolean };

/** The line's price in minor units, without shipping (the order carries shipping once). */
export type { LinePricing };

/** What a line keeps of her body once she has asked for her measurements to be erased (GDPR). */
export type Erased = Record<string, never>;
export const ERASED: Erased = {};

export function isErased<T extends object>(value: T | Erased): value is Erased {
	return Object.keys(value).length === 0;
}

/** A line as the drafting outputs read it. */
export interface StoredLine {
	measurements: StoredMeasurements | Erased;
	options: StoredChoice;
	adjustments: FitAdjustments | null;
	figuresSource: FigureSource;
	figures: Figures | Erased;
	fabricCm: number;
	pricing: LinePricing;
}

/** The measurements as the shop sends them (cm), kept as the snapshot: absent depths become null. */
export function storedMeasurements(m: Measurements): StoredMeasurements {
	return {
		waist: m.waist,
		hip: m.hip,
		length: m.length,
		waistToHip: m.waistToHip ?? null,
		...(m.waistToKnee !== undefined ? { waistToKnee: m.waistToKnee } : {}),
		...(m.confirmed ? { confirmed: true } : {})
	};
}

/** The engine's input for a stored line: the same draft the shopper was quoted; null once erased. */
export function draftInputOf(line: Pick<StoredLine, 'measurements' | 'options' | 'adjustments'>): { measurements: Measurements; choice: SkirtChoiceInput } | null {
	const m = line.measurements;
	if (isErased(m)) return null;
	const measurements: Measurements = {
		waist: m.waist,
		hip: m.hip,
		length: m.length,
		...(m.waistToHip !== null ? { waistToHip: m.waistToHip } : {}),
		...(m.waistToKnee !== null && m.waistToKnee !== undefined ? { waistToKnee: m.waistToKnee } : {}),
		...(m.confirmed ? { confirmed: true } : {}),
		...(line.adjustments ? { adjustments: line.adjustments } : {})
	};
	return { measurements, choice: line.options };
}
