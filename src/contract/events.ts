import { z } from 'zod';
import { emailSchema } from './auth';
import { nameText, optionalNameText } from './names';
import type { EventRole } from './auth';
import type { LinkAddress } from './linkAddress';

/*
 * The event setup API: events, divisions, sessions and their rounds, the entry list, staff,
 * target assignments and join codes. Shared by the organizer's screens and the server.
 */

// ---------- small building blocks ----------

/** A calendar date as YYYY-MM-DD that exists (no 31 April). */
export const dateSchema = z
  .string({ error: 'Enter a date as YYYY-MM-DD.' })
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Enter a date as YYYY-MM-DD.')
  .refine((value) => {
    const d = new Date(`${value}T00:00:00Z`);
    return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === value;
  }, 'That date does not exist.');

/** A local date and time in the event's time zone, as a date-time input gives it: YYYY-MM-DDTHH:mm. */
export const localDateTimeSchema = z
  .string({ error: 'Enter a start date and time.' })
  .regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/, 'Enter a start as date and time (YYYY-MM-DDTHH:mm).')
  .refine((value) => {
    const d = new Date(`${value}:00Z`);
    return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 16) === value;
  }, 'That date or time does not exist.');

/** True for a time zone name this platform knows (IANA, e.g. Europe/London). */
export function isTimeZone(name: string): boolean {
  try {
    new Intl.DateTimeFormat('en', { timeZone: name });
    return true;
  } catch {
    return false;
  }
}

export const timeZoneSchema = z
  .string({ error: 'Choose a time zone.' })
  .trim()
  .min(1, 'Choose a time zone.')
  .max(64, 'That time zone name is too long.')
  .refine(isTimeZone, 'That is not a time zone name. Use a name like Europe/London or America/Chicago.');

export const idSchema = z
  .number({ error: 'A number is needed here.' })
  .int('A whole number is needed here.')
  .positive('A number above 0 is needed here.');

export const bowStyleSchema = z.enum(['recurve', 'compound', 'barebow'], {
  error: 'Choose recurve, compound or barebow.',
});
export type BowStyleName = z.infer<typeof bowStyleSchema>;

export const POSITIONS = ['A', 'B', 'C', 'D'] as const;
export const positionSchema = z.enum(POSITIONS, { error: 'Choose position A, B, C or D.' });
export type Position = z.infer<typeof positionSchema>;

/** An edit (PATCH) must change something. */
const someChange = [
  (v: object) => Object.values(v).some((x) => x !== undefined),
  { message: 'Change at least one detail.' },
] as const;

/** Highest target number an event may use; well above any real field. */
export const MAX_TARGET_NUMBER = 500;

// ---------- events ----------

const endsAfterStart = (v: { startsOn?: string | undefined; endsOn?: string | undefined }) =>
  !v.startsOn || !v.endsOn || v.endsOn >= v.startsOn;

export const createEventSchema = z
  .object({
    name: nameText('the event name', 160),
    venue: optionalNameText('the venue', 160).default(''),
    startsOn: dateSchema,
    endsOn: dateSchema,
    timeZone: timeZoneSchema,
  })
  .refine(endsAfterStart, { message: 'The last day cannot be before the first day.', path: ['endsOn'] });
export type CreateEventInput = z.infer<typeof createEventSchema>;

export const updateEventSchema = z
  .object({
    name: nameText('the event name', 160).optional(),
    venue: optionalNameText('the venue', 160).optional(),
    startsOn: dateSchema.optional(),
    endsOn: dateSchema.optional(),
    timeZone: timeZoneSchema.optional(),
  })
  .refine(endsAfterStart, { message: 'The last day cannot be before the first day.', path: ['endsOn'] })
  .refine(...someChange);
export type UpdateEventInput = z.infer<typeof updateEventSchema>;

export type EventDetails = {
  id: number;
  name: string;
  venue: string;
  startsOn: string;
  endsOn: string;
  timeZone: string;
};

export type EventListItem = EventDetails & { roles: EventRole[] };
export type EventList = { events: EventListItem[] };

// ---------- divisions ----------

export const divisionInputSchema = z.object({
  bowStyle: bowStyleSchema,
  className: nameText('the class (for example Women, Men, Under 18)', 60),
});
export type DivisionInput = z.infer<typeof divisionInputSchema>;

export type Division = {
  id: number;
  bowStyle: BowStyleName;
  className: string;
  name: string;
  entryCount: number;
};

// ---------- sessions and rounds ----------

/** A round for one division in one session: a catalog id, or a whole custom round (checked by defineCustomRound). */
export const sessionRoundInputSchema = z.union(
  [
    z.object({ divisionId: idSchema, roundId: z.string().trim().min(1, 'Choose a round.').max(60) }),
    z.object({
      divisionId: idSchema,
      customRound: z.record(z.string(), z.unknown(), { error: 'A custom round must be an object.' }),
    }),
  ],
  { error: 'Each division needs a round: a catalog round or a custom one.' },
);
export type SessionRoundInput = z.infer<typeof sessionRoundInputSchema>;

export const sessionInputSchema = z.object({
  name: nameText('the session name', 120),
  startsAt: localDateTimeSchema,
  rounds: z
    .array(sessionRoundInputSchema, { error: 'List the divisions shooting in this session.' })
    .max(100, 'A session can hold at most 100 divisions.')
    .refine(
      (rs) => new Set(rs.map((r) => r.divisionId)).size === rs.length,
      'A division is listed twice in this session.',
    ),
});
export type SessionInput = z.infer<typeof sessionInputSchema>;

export const updateSessionSchema = sessionInputSchema.partial().refine(...someChange);
export type UpdateSessionInput = z.infer<typeof updateSessionSchema>;

/** The parts of a round a screen needs; the server keeps the full definition as a snapshot. */
export type RoundSummary = {
  id: string;
  name: string;
  custom: boolean;
  venue: 'outdoor' | 'indoor';
  distances: {
    label: string;
    distanceM: number;
    faceId: string;
    faceLabel: string;
    arrows: number;
    arrowsPerEnd: number;
  }[];
  arrows: number;
  ends: number;
  maxScore: number;
};

export type SessionRound = {
  divisionId: number;
  divisionName: string;
  bowStyle: BowStyleName;
  round: RoundSummary;
};

export type EventSession = {
  id: number;
  name: string;
  startsAt: string;
  closedAt: string | null;
  rounds: SessionRound[];
  assignedCount: number;
  targetCount: number;
};

// ---------- the event overview ----------

export type EventSummary = {
  event: EventDetails;
  myRoles: EventRole[];
  divisions: Division[];
  sessions: EventSession[];
  counts: {
    entries: number;
    divisions: number;
    sessions: number;
    organizers: number;
    judges: number;
    pendingInvitations: number;
  };
};

// ---------- entries ----------

export const entryInputSchema = z.object({
  name: nameText("the archer's name", 120),
  club: optionalNameText('the club', 120).default(''),
  email: z
    .union([z.literal(''), emailSchema], { error: 'That does not look like an e-mail address.' })
    .default(''),
  divisionId: idSchema,
  /** The archer's class inside the division (an age class); empty when the event uses none. */
  className: optionalNameText('the class (for example Under 18 or 50+)', 60).default(''),
});
export type EntryInput = z.infer<typeof entryInputSchema>;

export const updateEntrySchema = z
  .object({
    name: nameText("the archer's name", 120).optional(),
    club: optionalNameText('the club', 120).optional(),
    email: z
      .union([z.literal(''), emailSchema], { error: 'That does not look like an e-mail address.' })
      .optional(),
    divisionId: idSchema.optional(),
    className: optionalNameText('the class (for example Under 18 or 50+)', 60).optional(),
  })
  .refine(...someChange);
export type UpdateEntryInput = z.infer<typeof updateEntrySchema>;

export type Entry = {
  id: number;
  name: string;
  club: string;
  email: string;
  divisionId: number;
  divisionName: string;
  bowStyle: BowStyleName;
  /** The class inside the division; empty when none. */
  className: string;
  /** True once the archer has a Ringcall account linked to this entry. */
  linked: boolean;
};
export type EntryList = { entries: Entry[] };

/** The columns of an entry-list CSV file, in the template's order. */
export const ENTRY_CSV_COLUMNS = ['name', 'club', 'email', 'division', 'class'] as const;
export const ENTRY_CSV_MAX_BYTES = 512 * 1024;
export const ENTRY_CSV_MAX_ROWS = 2000;

export type ImportRow = {
  /** The row number as a spreadsheet shows it (the header is row 1). */
  row: number;
  name: string;
  club: string;
  email: string;
  division: string;
  /** The class inside the division (optional column). */
  className: string;
  problems: string[];
};
export type ImportPreview = { rows: ImportRow[]; readyCount: number; problemCount: number };
export type ImportResult = { imported: number };

// ---------- staff ----------

export const staffRoleSchema = z.enum(['organizer', 'judge'], { error: 'Choose organizer or judge.' });
export type StaffRole = z.infer<typeof staffRoleSchema>;

export const inviteStaffSchema = z.object({ email: emailSchema, role: staffRoleSchema });
export type InviteStaffInput = z.infer<typeof inviteStaffSchema>;

export type StaffMember = { userId: number; name: string; email: string; role: StaffRole; since: string };
export type PendingInvitation = {
  id: number;
  email: string;
  role: StaffRole;
  sentAt: string;
  expiresAt: string;
};
export type StaffList = { staff: StaffMember[]; invitations: PendingInvitation[] };

// ---------- targets ----------

export const moveArcherSchema = z.object({
  entryId: idSchema,
  targetNumber: idSchema.max(MAX_TARGET_NUMBER, `Targets are numbered up to ${MAX_TARGET_NUMBER}.`),
  position: positionSchema,
});
export type MoveArcherInput = z.infer<typeof moveArcherSchema>;

export const swapArchersSchema = z
  .object({ entryId: idSchema, otherEntryId: idSchema })
  .refine((v) => v.entryId !== v.otherEntryId, {
    message: 'Choose two different archers to swap.',
    path: ['otherEntryId'],
  });
export type SwapArchersInput = z.infer<typeof swapArchersSchema>;

export type TargetListArcher = {
  entryId: number;
  position: Position;
  name: string;
  club: string;
  divisionId: number;
  divisionName: string;
  bowStyle: BowStyleName;
  roundName: string | null;
  /** The faces of the archer's round, in shooting order, e.g. ["122 cm face"]. */
  faces: string[];
};

export type JoinCode = { code: string; joinUrl: string; qrDataUrl: string; createdAt: string };

export type Target = {
  targetNumber: number;
  archers: TargetListArcher[];
  /** Faces to hang on the boss: 1 for a shared face, one per archer when each position has its own. */
  facesPerTarget: number;
  /** Whether the archers share one face or each shoots their own (the six-ring and triple faces). */
  faceUse: 'shared' | 'one-per-archer';
  joinCode: JoinCode | null;
};

export type ConflictKind = 'position-taken' | 'too-many' | 'mixed-rounds' | 'unassigned' | 'no-round';
export type Conflict = {
  kind: ConflictKind;
  targetNumber: number | null;
  entryIds: number[];
  message: string;
};

export type UnassignedEntry = {
  entryId: number;
  name: string;
  divisionName: string;
  roundName: string | null;
};

export type TargetList = {
  session: { id: number; name: string; startsAt: string; closedAt: string | null };
  targets: Target[];
  unassigned: UnassignedEntry[];
  conflicts: Conflict[];
  /** The address the join links and QR codes of this session's printouts open. */
  linkAddress: LinkAddress;
};

export type AssignResult = TargetList & { assigned: number };
