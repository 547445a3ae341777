import type { Role } from '../../shared/contracts/roles.ts';

/**
 * The invented demo scenario: the crew-support team of the fictional "Lumen Ring" station.
 * Everyone here is made up; e-mails use the reserved example.test domain.
 */
export const DEMO_PASSWORD = 'lumen-ring-demo';

export interface DemoPerson {
  email: string;
  name: string;
  role: Role;
  /** For trainees: key of the crew member they are (see DEMO_CREW). */
  crewKey?: string;
}

export const DEMO_PEOPLE: DemoPerson[] = [
  { email: 'ada.quill@lumen.example.test', name: 'Ada Quill', role: 'admin' },
  { email: 'orrin.vale@lumen.example.test', name: 'Orrin Vale', role: 'planner' },
  { email: 'pim.sorrel@lumen.example.test', name: 'Pim Sorrel', role: 'planner' },
  { email: 'juno.brack@lumen.example.test', name: 'Dr. Juno Brack', role: 'reviewer' },
  { email: 'tamsin.reed@lumen.example.test', name: 'Tamsin Reed', role: 'trainee', crewKey: 'reed' },
  { email: 'bram.kettle@lumen.example.test', name: 'Bram Kettle', role: 'trainee', crewKey: 'kettle' },
  { email: 'ilse.moss@lumen.example.test', name: 'Ilse Moss', role: 'trainee', crewKey: 'moss' },
];

/** Crew members of the demo (the trainees above); their inertia profiles are seeded by the crew seed. */
export const DEMO_CREW: Record<string, { name: string; callSign: string }> = {
  reed: { name: 'Tamsin Reed', callSign: 'HERON' },
  kettle: { name: 'Bram Kettle', callSign: 'BADGER' },
  moss: { name: 'Ilse Moss', callSign: 'WREN' },
};
