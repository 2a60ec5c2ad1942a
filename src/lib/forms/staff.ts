import { z } from 'zod';
import { email } from '$lib/forms/auth';

export const inviteSchema = z.object({
	email,
	name: z.string().trim().max(120, 'Keep the name under 120 characters.')
});

export const ROLE_CHOICES = [
	{ id: 'shopper', label: 'Shopper', means: 'Their own measure cards and orders; no workroom and no back office.' },
	{
		id: 'cutter',
		label: 'Cutter',
		means: 'The workroom: the queue, cutting tickets and order stages. Not the back office.'
	},
	{ id: 'owner', label: 'Owner', means: 'Everything, including the catalogue, house rules, refunds and staff.' }
] as const;

export const roleSchema = z.object({
	role: z.enum(['shopper', 'cutter', 'owner'], { error: 'Choose a role.' }),
	confirm: z.boolean().refine((v) => v, 'Tick the box to confirm the change.')
});
