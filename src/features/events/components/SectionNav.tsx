import { Link } from 'react-router-dom';

export type Section = { id: string; label: string; count?: number };

/** The parts of an event's setup. The current one is marked with a shape and weight, not colour alone. */
export function SectionNav({ sections, current }: { sections: Section[]; current: string }) {
  return (
    <nav aria-label="Event setup" className="grid grid-cols-2 gap-2 sm:grid-cols-3">
      {sections.map((s) => {
        const active = s.id === current;
        return (
          <Link
            key={s.id}
            to={`?part=${s.id}`}
            replace
            aria-current={active ? 'page' : undefined}
            className={`surface flex min-h-14 items-center gap-2 rounded-lg border-2 px-3 text-lg ${
              active ? 'border-ink bg-ink font-bold text-white' : 'border-line bg-card text-ink'
            }`}
          >
            <span aria-hidden="true">{active ? '▶' : ''}</span>
            <span>
              {s.label}
              {s.count !== undefined && <span className={active ? '' : 'text-ink-soft'}> ({s.count})</span>}
            </span>
          </Link>
        );
      })}
    </nav>
  );
}
