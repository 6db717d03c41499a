import { Button } from '../components/Button';

type ErrorScreenProps = {
  /** Stable code a user can quote to support; never a stack trace. */
  code: string;
  message?: string;
};

export function ErrorScreen({ code, message }: ErrorScreenProps) {
  return (
    <section role="alert" className="mx-auto max-w-xl py-12">
      <h1 className="text-2xl font-semibold text-graphite-950">This screen ran into a problem</h1>
      <p className="mt-2 text-graphite-700">
        {message ?? 'Nothing you entered has been lost on the server. Reload the page to try again.'}
      </p>
      <p className="mt-4 text-sm text-graphite-500">
        Error code <span className="figures text-graphite-800">{code}</span>
      </p>
      <div className="mt-6">
        <Button variant="secondary" onClick={() => window.location.reload()}>
          Reload page
        </Button>
      </div>
    </section>
  );
}
