import { Link } from 'react-router-dom';

/** The empty state of a part that needs an earlier one: what is missing, and a way there. */
export function GoToPart({
  title,
  text,
  part,
  label,
}: {
  title: string;
  text: string;
  part: string;
  label: string;
}) {
  return (
    <>
      <h2 className="text-2xl font-bold">{title}</h2>
      <p>{text}</p>
      <Link
        to={`?part=${part}`}
        replace
        className="inline-flex min-h-14 items-center rounded-lg bg-moss px-5 text-lg font-bold text-white"
      >
        {label}
      </Link>
    </>
  );
}
