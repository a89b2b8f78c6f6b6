// See https://svelte.dev/docs/kit/types#app.d.ts
declare global {
	namespace App {
		/** Shape of every error SvelteKit renders or we answer in JSON (`{ error: App.Error }` on /api). */
		interface Error {
			message: string;
			code?: string;
			fields?: Record<string, string[] | undefined>;
		}
		interface Locals {
			/** The request's id: in its response's `x-request-id` and in every log line written for it. */
			requestId: string;
			user: { id: string; email: string; name: string } | null;
			session: { id: string; expiresAt: Date } | null;
			/**
			 * The signed-in user's role in each of their studios (studio id → role), read with the session
			 * when the request began; absent where no session was read (the authz check then asks the database).
			 */
			roles?: { readonly userId: string; readonly byStudio: Readonly<Record<string, import('$lib/roles').Role>> };
			/** Set when the database could not be reached while answering (answered 503). */
			databaseUnavailable?: boolean;
		}
		// interface PageData {}
		// interface PageState {}
		// interface Platform {}
	}
}

export {};
