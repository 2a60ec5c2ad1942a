import { sequence } from '@sveltejs/kit/hooks';
import type { HandleServerError } from '@sveltejs/kit';
import { authHandle } from '$lib/server/auth';
import { guard } from '$lib/server/hooks/guard';
import { securityHeaders } from '$lib/server/hooks/headers';
import { throttleCredentials } from '$lib/server/hooks/throttle';
import { currentUser } from '$lib/server/hooks/user';
import { startOutboxWorker } from '$lib/server/mail';
import { building } from '$app/environment';

if (!building) startOutboxWorker();

export const handle = sequence(securityHeaders, throttleCredentials, authHandle, currentUser, guard);

export const handleError: HandleServerError = ({ error, status, message }) => {
	if (status >= 500) console.error(error);
	return { message: status >= 500 ? 'Something went wrong on our side. Please try again in a moment.' : message };
};
