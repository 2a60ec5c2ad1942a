// How the workroom, the ticket and the mails address a shopper: by her first name only (the workroom
// never needs her full name, and a greeting reads warmer). One rule, so every page says the same.

/** The first word of a full name ("Chloé Marchand" → "Chloé"); the whole name when it is one word. */
export function firstName(full: string): string {
	return full.trim().split(/\s+/)[0] ?? '';
}
