import { Link } from 'react-router-dom';

export function NotFound() {
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-bold">Nothing here</h1>
      <p>This address is not a Ringcall screen. Check the link, or start again from the home screen.</p>
      <Link to="/" className="inline-flex min-h-14 items-center rounded-lg bg-moss px-5 font-bold text-white">
        Go to start
      </Link>
    </div>
  );
}
