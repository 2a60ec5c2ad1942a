// A made-up one-skirt order as the output specs draw it (only the specs use it): the ticket's model
// of it, turned into what the full-size outputs draw.
import { resolveRules } from '$lib/drafting';
import type { StoredChoice } from '../order/lines';
import { makeTicket } from './ticket';
import { sourceOf } from './source';

type Figures = { waist: number; hip: number; length: number; waistToHip: number };
type Cloth = { name: string; colour: string; fibreContent: string; widthCm: number };

export function specOrder(number: string, measurements: Figures, options: Omit<StoredChoice, 'stretch'>, cloth: Cloth = { name: 'Wool twill', colour: 'Navy', fibreContent: '100 % wool', widthCm: 150 }) {
	const ticket = makeTicket({
		orderId: 1,
		number,
		shopperName: 'Ada Vale',
		status: 'cutting',
		promisedDate: '2026-12-20',
		houseRulesId: 1,
		rules: resolveRules({}),
		line: { id: 1, index: 1, count: 1, styleName: options.style, measurements, options: { ...options, stretch: false } },
		fabric: { ...cloth, nap: false, stretch: false, shrinkagePct: 0 }
	});
	return sourceOf([ticket]);
}
