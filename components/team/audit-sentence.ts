/**
 * An audit event as a sentence a person reads ("Orrin Vale submitted 'Quarter turn left' v2") and
 * its recorded detail as readable lines ("Role: planner → reviewer"), from the action code, the
 * actor's and object's names the API adds, and the detail JSON.
 */
import type { AuditEvent } from '@/shared/contracts/team';

/** `{o}` is replaced by the object's name (or its kind in words when it has none). */
const TEMPLATES: Record<string, string> = {
  'auth.sign_in': 'signed in',
  'auth.sign_out': 'signed out',
  'auth.password_changed': 'changed their password',
  'team.invite': 'invited {o}',
  'team.accept_invitation': 'accepted an invitation and joined',
  'team.update_user': 'changed the role or access of {o}',
  'crew.create': 'added {o} to the crew',
  'crew.save_profile': 'saved {o}',
  'crew.archive': 'archived {o}',
  'crew.restore': 'restored {o} from the archive',
  'suit.update': 'edited the suit {o}',
  'sequence.create': 'created the maneuver {o}',
  'sequence.update': 'changed the maneuver {o}',
  'sequence.archive': 'archived the maneuver {o}',
  'sequence.restore': 'restored the maneuver {o} from the archive',
  'sequence.delete': 'deleted the never-submitted maneuver {o}',
  'sequence_version.save': 'saved {o}',
  'sequence_version.submit': 'submitted {o}',
  'sequence_version.comment': 'commented on {o}',
  'sequence_version.clear': 'cleared {o}',
  'sequence_version.send_back': 'sent back {o}',
  'sequence_version.recheck': 'flagged {o} for a re-check',
  'sequence_version.reverified': 're-verified {o}',
  'sequence_version.recheck_saved': 'saved {o} as a re-check for the reviewer',
  'sequence_version.replace': 'replaced {o}',
  'upload.import': 'imported {o}',
  'upload.reject': 'uploaded {o}; nothing was imported',
  'cue_card.download': 'downloaded the cue card of {o}',
  'rehearsal.log': 'logged a rehearsal',
  'rehearsal.sign_off': 'signed off a rehearsal',
  'rehearsal.recording': 'added a recording to a rehearsal',
  'recording.remap': 'changed the joint mapping of {o}',
  'plan.request': 'asked the planner to suggest steps',
  'plan.done': 'planner finished suggesting steps',
  'plan.failed': 'planner could not suggest steps',
  'robustness.queued': 'queued a robustness run',
  'robustness.done': 'robustness run finished',
  'robustness.cancel': 'cancelled a robustness run',
};

/** What an object is, in words, when it has no name to show. */
const OBJECT_WORDS: Record<string, string> = {
  sequence: 'a maneuver', sequence_version: 'a maneuver version', crew_member: 'a crew member', profile_version: 'a profile version',
  user: 'a team member', invitation: 'someone', upload: 'a file', suit_config: 'a suit', plan: 'a plan', recording: 'a recording', rehearsal: 'a rehearsal',
};

/** Actions the system does on its own read without a subject. */
const SUBJECTLESS = new Set(['plan.done', 'plan.failed', 'robustness.done']);

const detailObject = (e: AuditEvent): Record<string, unknown> => (e.detail && typeof e.detail === 'object' && !Array.isArray(e.detail) ? (e.detail as Record<string, unknown>) : {});

/** The object's name, or for an invitation the invited address, or the object's kind in words. */
function objectText(e: AuditEvent): string {
  if (e.objectLabel) return e.objectLabel;
  const d = detailObject(e);
  if (e.objectType === 'invitation' && typeof d.email === 'string') return d.email;
  // A deleted object has no row to name it: its name is kept in the detail.
  if (typeof d.name === 'string' && d.name) return `'${d.name}'`;
  return OBJECT_WORDS[e.objectType] ?? e.objectType.replace(/_/g, ' ');
}

/** The event as one sentence, e.g. "Orrin Vale submitted 'Quarter turn left' v2". */
export function auditSentence(e: AuditEvent): string {
  const actor = e.actorName ?? e.actorEmail ?? 'The system';
  const template = TEMPLATES[e.action];
  if (template) {
    const text = template.replace('{o}', objectText(e));
    return SUBJECTLESS.has(e.action) ? text.charAt(0).toUpperCase() + text.slice(1) : `${actor} ${text}`;
  }
  // an action this page has no words for yet: still a readable line
  const words = e.action.replace(/[._]/g, ' ');
  return `${actor}: ${words}${e.objectLabel ? ` — ${e.objectLabel}` : ''}`;
}

/** "completedSteps" → "Completed steps". */
function keyWords(key: string): string {
  const s = key.replace(/([a-z0-9])([A-Z])/g, '$1 $2').replace(/_/g, ' ').toLowerCase();
  return s.charAt(0).toUpperCase() + s.slice(1);
}

function valueText(v: unknown): string {
  if (v === null || v === undefined) return '—';
  if (typeof v === 'string') return v;
  if (typeof v === 'number' || typeof v === 'boolean') return String(v);
  if (Array.isArray(v)) return v.length === 0 ? 'none' : v.map(valueText).join(', ');
  const text = JSON.stringify(v);
  return text.length > 120 ? `${text.slice(0, 117)}…` : text;
}

/**
 * The recorded detail as lines: a change ({ from, to } / { before, after }) as "Key: a → b", other
 * values as "Key: value". Ids stay out (the sentence names the object).
 */
export function auditDetailLines(e: AuditEvent): string[] {
  const lines: string[] = [];
  for (const [key, v] of Object.entries(detailObject(e))) {
    if (/id$/i.test(key) && typeof v === 'string') continue;
    if (v && typeof v === 'object' && !Array.isArray(v)) {
      const o = v as Record<string, unknown>;
      if ('from' in o || 'to' in o) { lines.push(`${keyWords(key)}: ${valueText(o.from)} → ${valueText(o.to)}`); continue; }
      if ('before' in o || 'after' in o) { lines.push(`${keyWords(key)}: ${valueText(o.before)} → ${valueText(o.after)}`); continue; }
    }
    lines.push(`${keyWords(key)}: ${valueText(v)}`);
  }
  return lines;
}

/** Every action the log has words for, as filter options ("Submitted a maneuver version"), sorted by label. */
export const AUDIT_ACTION_OPTIONS: readonly { value: string; label: string }[] = Object.entries(TEMPLATES)
  .map(([value, t]) => {
    const words = t.replace(' {o}', '').replace('{o}', '');
    return { value, label: words.charAt(0).toUpperCase() + words.slice(1) };
  })
  .sort((a, b) => a.label.localeCompare(b.label));

/** Date presets of the filter: whole UTC days ending today. */
export const AUDIT_DATE_PRESETS = [
  { value: 'today', label: 'Today', days: 1 },
  { value: '7d', label: 'Last 7 days', days: 7 },
  { value: '30d', label: 'Last 30 days', days: 30 },
] as const;

/** A preset as the form's since/until days (YYYY-MM-DD, UTC), counted back from `now`. */
export function presetDays(days: number, now: Date = new Date()): { since: string; until: string } {
  const until = now.toISOString().slice(0, 10);
  const since = new Date(now.getTime() - (days - 1) * 86_400_000).toISOString().slice(0, 10);
  return { since, until };
}
