// The fit loop's mails, in the words of its pages ("Tell us how it fits", "Remake", "Alteration").
import { layout } from './templates';
import { ANSWER_TIME, REPORT_RECEIVED, cardWords, decisionLead, photoWords, remakeOfWords, sentWords, wishWords } from '$lib/fit/words';

const firstName = (name: string) => name.trim().split(/\s+/)[0] ?? name;

function fitMail(subject: string, name: string, paragraphs: string[], link: string, label: string) {
	const all = [`Dear ${firstName(name)},`, ...paragraphs];
	return { subject, text: `${all.join('\n\n')}\n\n${label}: ${link}\n`, html: layout(subject, all, { href: link, label }) };
}

export function reportReceivedMail(o: { number: string; shopperName: string; link: string; wish: 'alteration' | 'remake'; photoRetentionDays: number }) {
	return fitMail(`We have your fit report for order ${o.number}`, o.shopperName, [`${REPORT_RECEIVED} ${wishWords(o.wish)}`, ANSWER_TIME, photoWords(o.photoRetentionDays)], o.link, 'See your fit report');
}

export type DecisionMail = {
	number: string;
	shopperName: string;
	link: string;
	decision: 'alteration' | 'remake' | 'decline';
	reason: string;
	changes: string[];
	remakeNumber?: string;
	promisedDate?: string;
};

const DECISION_SUBJECT = {
	remake: (n: string) => `We are making your skirt again (order ${n})`,
	alteration: (n: string) => `We will alter your skirt (order ${n})`,
	decline: (n: string) => `About your fit report for order ${n}`
} as const;

/** The decision in her fit page's words: its lead, the reason she is given, the card's corrections. */
export function decisionMail(o: DecisionMail) {
	const paragraphs = [decisionLead(o), o.reason, cardWords(o.changes)].filter(Boolean);
	if (o.decision === 'decline') paragraphs.push('If you would like to talk it over, reply to this e-mail.');
	return fitMail(DECISION_SUBJECT[o.decision](o.number), o.shopperName, paragraphs, o.link, 'See your fit report');
}

export function remakeShippedMail(o: { number: string; remakeOf: string; shopperName: string; carrier: string; tracking: string; link: string }) {
	return fitMail(
		`Your remade skirt has shipped (order ${o.number})`,
		o.shopperName,
		[`${remakeOfWords(o.remakeOf)} It has shipped. ${sentWords(o.carrier, o.tracking)}`, 'It is drafted with the corrections on your measure card. Tell us how it fits, the same way as before.'],
		o.link,
		`See order ${o.number}`
	);
}
