// The fit loop's sentences, written once: her fit page and order page show them, and the mails of each
// step (report received, decision, remake shipped) send them, so she reads the same words in both.

export const REPORT_RECEIVED = 'Thank you: we have your report. The atelier reads every report and decides with you: an alteration, a remake, or an explanation.';
export const ANSWER_TIME = 'We answer within a few working days.';

export const wishWords = (wish: 'alteration' | 'remake') => `You asked for ${wish === 'remake' ? 'a remake' : 'an alteration'}.`;

/** Where her photos go and for how long (days: the shop's photo retention setting). */
export const photoWords = (days: number) => `Your photos are seen only by you and the atelier; kept ${days} days, then deleted on their own. You can delete them from your fit report at any time.`;

export type DecisionWords = { decision: 'alteration' | 'remake' | 'decline'; remakeNumber?: string | null; promisedDate?: string | null };

/** The decision's first sentence, beginning with its name as her fit page labels it. */
export function decisionLead(d: DecisionWords): string {
	if (d.decision === 'remake') return `Remake: we cut your skirt again${d.remakeNumber ? ` as order ${d.remakeNumber}` : ''}, at no charge.${d.promisedDate ? ` We plan to ship it by ${d.promisedDate}.` : ''} You may keep the first skirt.`;
	if (d.decision === 'alteration') return 'Alteration: please send the skirt back to the atelier; we alter it and ship it to you again, at no charge. The order page shows where it is.';
	return 'Declined: we have looked at your fit report carefully and will not remake or alter this skirt.';
}

/** The corrections on her card, as her fit page and the decision mail list them. */
export const cardWords = (changes: string[]) => (changes.length ? `On your measure card: ${changes.join('; ')}.` : '');

/** The remake's order page and its shipping mail. */
export const remakeOfWords = (first: string) => `This skirt is the remake of order ${first}, made at no charge.`;
export const sentWords = (carrier: string, tracking: string) => `Sent with ${carrier}, tracking number ${tracking}.`;
