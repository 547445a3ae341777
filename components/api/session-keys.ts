/** Query keys of the signed-in session. */
export const sessionKeys = {
  all: ['session'] as const,
  /** GET /api/me → the user, or null when signed out. */
  me: () => [...sessionKeys.all, 'me'] as const,
};
