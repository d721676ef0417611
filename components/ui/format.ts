const dateFormat = new Intl.DateTimeFormat('en-GB', { timeZone: 'UTC', day: 'numeric', month: 'short', year: 'numeric' });

/** 'YYYY-MM-DD' -> '12 Mar 2026' (calendar date, no time-zone shift). */
export function formatDate(isoDate: string | null | undefined): string {
  if (!isoDate) return '—';
  return dateFormat.format(new Date(`${isoDate}T00:00:00Z`));
}

export const contextLabels = { lesson: 'Lesson', practice: 'Practice', 'on-course': 'On course' } as const;
export const roleLabels = { admin: 'Academy admin', coach: 'Coach', student: 'Student', researcher: 'Researcher' } as const;
export const rolePluralLabels = { admin: 'Academy admins', coach: 'Coaches', student: 'Students', researcher: 'Researchers' } as const;
export const handednessLabels = { right: 'Right-handed', left: 'Left-handed' } as const;
