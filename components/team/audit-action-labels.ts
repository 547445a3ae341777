/**
 * Plain-language names of audit actions, keyed by the server's action code. Codes not listed show
 * as they are, so new areas need no change here to appear in the log (add a line for a nicer name).
 */
export const AUDIT_ACTION_LABELS: Record<string, string> = {
  'auth.sign_in': 'Signed in',
  'auth.sign_out': 'Signed out',
  'auth.password_changed': 'Changed their password',
  'team.invite': 'Invited someone',
  'team.accept_invitation': 'Accepted an invitation',
  'team.update_user': 'Changed a role or access',
};

/** The plain-language name of an action code, or the code itself. */
export function auditActionLabel(action: string): string {
  return AUDIT_ACTION_LABELS[action] ?? action;
}
