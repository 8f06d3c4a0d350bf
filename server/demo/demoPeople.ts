/**
 * The invented demo scenario: the Larchmere Fletchers' autumn field shoot. Every name here is made up.
 */
export const DEMO_PASSWORD = 'larchmere-demo';

export const DEMO_CLUB = 'Larchmere Fletchers';

export const DEMO_EVENT = {
  name: 'Larchmere Autumn Field Shoot',
  venue: 'Larchmere Common, east meadow',
  startsOn: '2026-12-12',
  endsOn: '2026-12-12',
  timeZone: 'Europe/London',
};

export const DEMO_ORGANIZER = { email: 'organizer@ringcall.example', name: 'Priya Castellan' };
export const DEMO_JUDGES = [
  { email: 'judge.wren@ringcall.example', name: 'Tobias Wren' },
  { email: 'judge.okafor@ringcall.example', name: 'Adaeze Okafor' },
];

export const DEMO_DIVISIONS = [
  { bowStyle: 'recurve', className: 'Women', name: 'Recurve Women' },
  { bowStyle: 'recurve', className: 'Men', name: 'Recurve Men' },
  { bowStyle: 'compound', className: 'Women', name: 'Compound Women' },
  { bowStyle: 'compound', className: 'Men', name: 'Compound Men' },
  { bowStyle: 'barebow', className: 'Women', name: 'Barebow Women' },
  { bowStyle: 'barebow', className: 'Men', name: 'Barebow Men' },
] as const;

/** The demo's one session: each division shoots the catalog round for its bow style. */
export const DEMO_SESSION = {
  name: 'Saturday qualification',
  startsAt: '2026-12-12T09:30',
  roundFor: { recurve: '70m', compound: '50m-compound', barebow: '50m-barebow' },
} as const;

const WOMEN = [
  'Ines',
  'Marta',
  'Siobhan',
  'Yuki',
  'Leonie',
  'Farah',
  'Greta',
  'Noor',
  'Ottilie',
  'Bea',
  'Rosa',
  'Camille',
];
const MEN = [
  'Anselm',
  'Dario',
  'Kwame',
  'Lars',
  'Matteo',
  'Ruairi',
  'Tadeusz',
  'Emil',
  'Jonah',
  'Pavel',
  'Idris',
  'Sven',
];
const SURNAMES = [
  'Ashdown',
  'Brightwater',
  'Calloway',
  'Dunmore',
  'Elsworth',
  'Fenwick',
  'Garrow',
  'Halloran',
  'Inchbald',
  'Jessop',
  'Kilbride',
  'Lowther',
  'Marchbank',
  'Nettleford',
  'Ormsby',
  'Pennock',
  'Quarrie',
  'Rushworth',
];
const CLUBS = [DEMO_CLUB, 'Stonebridge Bowmen', 'Kestrel Vale Archers', 'Millrace Toxophilites'];

export type DemoArcher = { name: string; email: string; club: string; division: string; className: string };

/** Age classes inside each division: two of its six archers shoot as juniors, one as a master. */
const DEMO_CLASSES = ['', 'Under 21', '', '50+', 'Under 21', ''];

/** Thirty-six archers, six per division, with stable invented names and addresses. */
export function demoArchers(): DemoArcher[] {
  const archers: DemoArcher[] = [];
  let n = 0;
  for (const [d, division] of DEMO_DIVISIONS.entries()) {
    const firstNames = division.className === 'Women' ? WOMEN : MEN;
    for (let i = 0; i < 6; i += 1) {
      // Steps of 5 through 12 first names and 18 surnames never repeat within a division.
      const first = firstNames[(d * 3 + i * 5) % firstNames.length]!;
      const last = SURNAMES[(d * 7 + i * 5) % SURNAMES.length]!;
      archers.push({
        name: `${first} ${last}`,
        email: `${first}.${last}.${n}@ringcall.example`.toLowerCase(),
        club: CLUBS[n % CLUBS.length]!,
        division: division.name,
        className: DEMO_CLASSES[i]!,
      });
      n += 1;
    }
  }
  return archers;
}

/** The archer account shown in the start-up banner. */
export const DEMO_ARCHER_EMAIL = (): string => demoArchers()[0]!.email;
