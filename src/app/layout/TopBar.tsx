import { Link } from 'react-router-dom';
import type { Me } from '../../features/auth/api/get-me';
import { authPaths, paths } from '../../lib/paths';
import { roleLabels } from '../../lib/permissions';
import { Wordmark } from '../../components/Wordmark';

export function TopBar({ me }: { me: Me }) {
  return (
    <header className="flex h-14 items-center justify-between gap-4 bg-graphite-950 px-4 text-paper-100">
      <Link to={paths.home.href()} aria-label="Fluxtrail home" className="rounded">
        <Wordmark />
      </Link>
      <div className="flex min-w-0 items-center gap-3 text-sm">
        <span className="truncate" title={me.user.email}>
          {me.user.name}
        </span>
        <span className="rounded border border-graphite-600 px-2 py-0.5 text-xs uppercase tracking-wider text-graphite-200">
          {roleLabels[me.role]}
        </span>
        {/* A full-page navigation: the server ends the session and the IdP returns us to /signed-out. */}
        <a
          href={authPaths.logout()}
          className="rounded px-2 py-1 text-graphite-200 underline-offset-4 hover:text-paper-50 hover:underline"
        >
          Sign out
        </a>
      </div>
    </header>
  );
}
