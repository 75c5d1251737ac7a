import type { Role } from '../auth/permissions.js';

/** A demo person of the invented company Quillfield Conveyor Works (credentials listed in the README). */
export interface DemoPerson {
  email: string;
  name: string;
  role: Role;
  password: string;
}

/** One demo user per role. Names and addresses are invented (`.example` is a reserved domain). */
export const DEMO_PEOPLE: readonly DemoPerson[] = [
  { email: 'ada.admin@quillfield.example', name: 'Ada Brennholt', role: 'admin', password: 'quillfield-admin-2026' },
  { email: 'emil.engineer@quillfield.example', name: 'Emil Varga-Lund', role: 'engineer', password: 'quillfield-engineer-2026' },
  { email: 'vera.viewer@quillfield.example', name: 'Vera Osei-Marsh', role: 'viewer', password: 'quillfield-viewer-2026' },
];
