import { error, fail } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { deliverQueued } from '$lib/server/mail';
import { decideReport, readChanges } from '$lib/server/fit/decide';
import { fitReportForStaff, requireFitDecider } from '$lib/server/fit/workroom';
import { CORRECTABLE, suggestedChanges } from '$lib/fit/report';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	await requireFitDecider(db, event);
	const found = await fitReportForStaff(db, Number(event.params.id));
	if (!found) error(404, 'No such fit report.');
	return { ...found, suggested: suggestedChanges(found.report.answers) };
};

export const actions: Actions = {
	decide: async (event) => {
		const user = await requireFitDecider(db, event);
		const form = await event.request.formData();
		const decision = String(form.get('decision') ?? '');
		if (decision !== 'alteration' && decision !== 'remake' && decision !== 'decline') return fail(400, { message: 'Choose alteration, remake or decline.', errors: {} as Record<string, string> });
		const { changes, errors } = readChanges(form, CORRECTABLE);
		if (Object.keys(errors).length) return fail(400, { message: 'Some corrections need another look.', errors });
		const result = await decideReport(db, { reportId: Number(event.params.id), decision, reason: String(form.get('reason') ?? ''), changes, actor: { id: user.id, label: user.name } });
		if (!result.ok) return fail(result.status, { message: result.message, errors: {} as Record<string, string> });
		void deliverQueued(result.mailIds);
		return { decided: decision, remakeNumber: result.remakeNumber, remakeOrderId: result.remakeOrderId };
	}
};
