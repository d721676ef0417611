// The invented demo scenario (academy, people and clubs are made up). Fixed ids keep the seed deterministic.
export const DEMO_PASSWORD = 'stanceline-demo';
export const DEMO_ACADEMY = { id: 1, name: 'Harrow Vale Golf Academy', slug: 'harrow-vale' } as const;

type Role = 'admin' | 'coach' | 'student' | 'researcher';
export interface DemoUser {
  id: number;
  email: string;
  name: string;
  role: Role;
}

export const DEMO_USERS: readonly DemoUser[] = [
  { id: 1, email: 'admin@stanceline.test', name: 'Wren Castellane', role: 'admin' },
  { id: 2, email: 'coach@stanceline.test', name: 'Maren Solberg', role: 'coach' },
  { id: 3, email: 'coach2@stanceline.test', name: 'Tobias Quill', role: 'coach' },
  { id: 4, email: 'student@stanceline.test', name: 'Ada Fenwick', role: 'student' },
  { id: 5, email: 'researcher@stanceline.test', name: 'Elio Varnholt', role: 'researcher' },
];

export interface DemoAthlete {
  id: number;
  userId: number | null;
  coachUserId: number;
  displayName: string;
  handedness: 'right' | 'left';
  stanceWidthMm: number;
  dateOfBirth: string | null;
  homeClub: string | null;
}

export const DEMO_ATHLETES: readonly DemoAthlete[] = [
  { id: 1, userId: 4, coachUserId: 2, displayName: 'Ada Fenwick', handedness: 'right', stanceWidthMm: 380, dateOfBirth: '1994-03-12', homeClub: 'Harrow Vale Golf Club' },
  { id: 2, userId: null, coachUserId: 2, displayName: 'Jonah Pelliker', handedness: 'left', stanceWidthMm: 430, dateOfBirth: null, homeClub: 'Fernmoor Links' },
  { id: 3, userId: null, coachUserId: 2, displayName: 'Sunniva Ashdale', handedness: 'right', stanceWidthMm: 360, dateOfBirth: '1988-11-02', homeClub: null },
  { id: 4, userId: null, coachUserId: 3, displayName: 'Rafe Dunmoor', handedness: 'right', stanceWidthMm: 450, dateOfBirth: null, homeClub: 'Harrow Vale Golf Club' },
  // Under 18 in 2026: sessions with a minor need a guardian's consent under the academy's and local rules.
  { id: 5, userId: null, coachUserId: 3, displayName: 'Lotte Brenmark', handedness: 'left', stanceWidthMm: 340, dateOfBirth: '2010-06-04', homeClub: 'Oakridge Heath Juniors' },
  { id: 6, userId: null, coachUserId: 3, displayName: 'Osric Tammeline', handedness: 'right', stanceWidthMm: 410, dateOfBirth: '1979-01-23', homeClub: null },
];

export interface DemoSession {
  id: number;
  athleteId: number;
  coachUserId: number | null;
  sessionDate: string;
  context: 'lesson' | 'practice' | 'on-course';
  location: string | null;
  notes: string | null;
}

export const DEMO_SESSIONS: readonly DemoSession[] = [
  { id: 1, athleteId: 1, coachUserId: 2, sessionDate: '2026-02-10', context: 'lesson', location: 'Studio bay 2', notes: 'Baseline: pressure stays on the lead heel too early in the downswing.' },
  { id: 2, athleteId: 1, coachUserId: null, sessionDate: '2026-02-17', context: 'practice', location: 'Range, mat 6', notes: 'Step drill, three sets of ten at half speed.' },
  { id: 3, athleteId: 1, coachUserId: 2, sessionDate: '2026-03-03', context: 'on-course', location: 'Holes 1-9', notes: 'Uneven lies; compare trail-side loading with the studio baseline.' },
  { id: 4, athleteId: 2, coachUserId: 2, sessionDate: '2026-02-12', context: 'lesson', location: 'Studio bay 1', notes: 'Left-handed: check the mirrored foot labels before reviewing.' },
  { id: 5, athleteId: 2, coachUserId: null, sessionDate: '2026-02-26', context: 'practice', location: 'Short-game area', notes: null },
  { id: 6, athleteId: 3, coachUserId: 2, sessionDate: '2026-01-20', context: 'lesson', location: 'Studio bay 2', notes: 'Stance width narrowed from 400 to 360 mm.' },
  { id: 7, athleteId: 3, coachUserId: 2, sessionDate: '2026-03-10', context: 'on-course', location: 'Holes 10-18', notes: null },
  { id: 8, athleteId: 4, coachUserId: 3, sessionDate: '2026-02-05', context: 'lesson', location: 'Studio bay 3', notes: 'Driver: slow transfer towards the lead side.' },
  { id: 9, athleteId: 4, coachUserId: null, sessionDate: '2026-02-19', context: 'practice', location: 'Range, mat 2', notes: null },
  { id: 10, athleteId: 5, coachUserId: 3, sessionDate: '2026-02-07', context: 'lesson', location: 'Studio bay 3', notes: 'Junior: guardian present; short session, no loaded rotation drills.' },
  { id: 11, athleteId: 5, coachUserId: 3, sessionDate: '2026-03-14', context: 'on-course', location: 'Holes 1-6', notes: null },
  { id: 12, athleteId: 6, coachUserId: 3, sessionDate: '2026-01-28', context: 'lesson', location: 'Studio bay 1', notes: 'Back stiffness reported; cleared by his physiotherapist before full swings.' },
  { id: 13, athleteId: 6, coachUserId: null, sessionDate: '2026-02-24', context: 'practice', location: 'Range, mat 4', notes: 'Half swings only.' },
];
