import { uploadFieldsSchema } from '@/lib/recordings/fields';

// The upload options as the form holds them, and the multipart text fields they become. The fields are checked
// with the same zod schema POST /api/recordings uses (lib/recordings/fields.ts), so a bad layout or profile file,
// stance width or cutoff is shown on its field before any byte is sent.

export type LayoutChoice = '' | 'pair-8' | 'pair-16' | 'file';

export type UploadOptionsState = {
  /** '' = a new session created with this upload */
  sessionId: string;
  /** '' = the layout the file names in its "# layout:" line */
  layoutChoice: LayoutChoice;
  layoutFile: { name: string; text: string } | null;
  /** '' = none (recording format 1), 'file' = a profile file, else the id of a saved profile */
  profileChoice: string;
  profileFile: { name: string; text: string } | null;
  saveProfileAs: string;
  /** '' = the file's own metadata, else the player's profile (an explicit choice here wins over both) */
  handedness: '' | 'right' | 'left';
  /** '' = the file's own metadata, else the player's profile */
  stanceWidthMm: string;
  cutoffHz: string;
};

export type OptionErrors = Partial<Record<'sessionId' | 'layout' | 'profile' | 'profileId' | 'saveProfileAs' | 'handedness' | 'stanceWidthMm' | 'cutoffHz' | '_form', string>>;

export function toUploadFields(athleteId: number, o: UploadOptionsState): Record<string, string> {
  const fields: Record<string, string> = { athleteId: String(athleteId), cutoffHz: o.cutoffHz };
  // precedence: a value chosen here > the file's metadata > the player's profile > defaults (lib/recordings/options.ts)
  if (o.handedness) fields.handedness = o.handedness;
  if (o.stanceWidthMm.trim()) fields.stanceWidthMm = o.stanceWidthMm;
  if (o.sessionId) fields.sessionId = o.sessionId;
  if (o.layoutChoice === 'file') fields.layout = o.layoutFile?.text ?? '';
  else if (o.layoutChoice) fields.layout = o.layoutChoice;
  if (o.profileChoice === 'file') {
    fields.profile = o.profileFile?.text ?? '';
    if (o.saveProfileAs.trim()) fields.saveProfileAs = o.saveProfileAs.trim();
  } else if (o.profileChoice) {
    fields.profileId = o.profileChoice;
  }
  return fields;
}

/** Field errors of the options, or null when they are fine. */
export function checkUploadOptions(athleteId: number, o: UploadOptionsState): OptionErrors | null {
  const errors: OptionErrors = {};
  if (o.layoutChoice === 'file' && !o.layoutFile) errors.layout = 'Choose a layout file (JSON), or pick a preset.';
  if (o.profileChoice === 'file' && !o.profileFile) errors.profile = 'Choose an import profile file (JSON), or pick “none”.';
  const parsed = uploadFieldsSchema.safeParse(toUploadFields(athleteId, o));
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const key = (issue.path[0] ?? '_form') as keyof OptionErrors;
      errors[key] ??= issue.message;
    }
  }
  return Object.keys(errors).length > 0 ? errors : null;
}
