// The fit loop's mails, in the words of its pages ("Tell us how it fits", "Remake", "Alteration").
import { layout } from './templates';

const firstName = (name: string) => name.trim().split(/\s+/)[0] ?? name;

function fitMail(subject: string, name: string, paragraphs: string[], link: string, label: string) {
	const all = [`Dear ${firstName(name)},`, ...paragraphs];
	return { subject, text: `${all.join('\n\n')}\n\n${label}: ${link}\n`, html: layout(subject, all, { href: link, label }) };
}

export function reportReceivedMail(o: { number: string; shopperName: string; link: string; wish: 'alteration' | 'remake' }) {
	return fitMail(
		`We have your fit report for order ${o.number}`,
		o.shopperName,
		[
			`Thank you for telling us how it fits. The atelier reads every report and decides with you: an alteration, a remake, or an explanation. You asked for ${o.wish === 'remake' ? 'a remake' : 'an alteration'}.`,
			'We answer within a few working days. Your photos are seen only by you and the atelier, and you can delete them from the same page at any time.'
		],
		o.link,
		'See your fit report'
	);
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

export function decisionMail(o: DecisionMail) {
	const changes = o.changes.length ? [`What we change on your measure card: ${o.changes.join('; ')}.`] : [];
	if (o.decision === 'remake') {
		return fitMail(
			`We are making your skirt again (order ${o.number})`,
			o.shopperName,
			[`Remake: we cut your skirt again as order ${o.remakeNumber}, at no charge. We plan to ship it by ${o.promisedDate}.`, o.reason, ...changes, 'You may keep the first skirt.'],
			o.link,
			'See your fit report'
		);
	}
	if (o.decision === 'alteration') {
		return fitMail(
			`We will alter your skirt (order ${o.number})`,
			o.shopperName,
			[
				'Alteration: please send the skirt back to the atelier; we alter it and ship it to you again, at no charge. The order page shows where it is.',
				o.reason,
				...changes
			],
			o.link,
			'See your fit report'
		);
	}
	return fitMail(`About your fit report for order ${o.number}`, o.shopperName, ['We have looked at your fit report carefully and will not remake or alter this skirt.', `Why: ${o.reason}`, 'If you would like to talk it over, reply to this e-mail.'], o.link, 'See your fit report');
}

export function remakeShippedMail(o: { number: string; remakeOf: string; shopperName: string; carrier: string; tracking: string; link: string }) {
	return fitMail(
		`Your remade skirt has shipped (order ${o.number})`,
		o.shopperName,
		[`Your remake of order ${o.remakeOf} is on its way with ${o.carrier}. Tracking number: ${o.tracking}.`, 'It is drafted with the corrections on your measure card. Tell us how it fits, the same way as before.'],
		o.link,
		`See order ${o.number}`
	);
}
