import { describe, expect, it } from 'vitest';

import { auditDetailLines, auditSentence } from '../../components/team/audit-sentence.ts';
import type { AuditEvent } from '../../shared/contracts/team.ts';

const base: AuditEvent = {
  id: 1, at: '2026-03-14T10:00:00.000Z', actorId: 'u1', actorEmail: 'orrin.vale@lumen.example.test', actorName: 'Orrin Vale',
  action: 'sequence_version.submit', objectType: 'sequence_version', objectId: 'v1', objectLabel: "'Quarter turn left' v2", detail: null,
};

describe('audit events as sentences', () => {
  it('names the person and the object: a submitted version', () => {
    expect(auditSentence(base)).toBe("Orrin Vale submitted 'Quarter turn left' v2");
  });
  it('an object that is gone reads as its kind in words', () => {
    expect(auditSentence({ ...base, objectLabel: null })).toBe('Orrin Vale submitted a maneuver version');
  });
  it('an invitation names the invited address from the detail', () => {
    expect(auditSentence({ ...base, action: 'team.invite', objectType: 'invitation', objectLabel: null, detail: { email: 'new.person@lumen.example.test', role: 'planner' } }))
      .toBe('Orrin Vale invited new.person@lumen.example.test');
  });
  it('an action without words yet still reads, with no raw ids', () => {
    expect(auditSentence({ ...base, action: 'crew.hibernate', objectType: 'crew_member', objectLabel: 'Tamsin Reed' })).toBe('Orrin Vale: crew hibernate — Tamsin Reed');
  });
  it('the system as the actor when there is none', () => {
    expect(auditSentence({ ...base, actorId: null, actorEmail: null, actorName: null, action: 'sequence_version.recheck' })).toBe("The system flagged 'Quarter turn left' v2 for a re-check");
  });
  it('a change in the detail reads "Key: before → after"; ids are left out', () => {
    expect(auditDetailLines({ ...base, detail: { role: { from: 'planner', to: 'reviewer' }, userId: 'abc', completedSteps: 3 } })).toEqual(['Role: planner → reviewer', 'Completed steps: 3']);
  });
});
