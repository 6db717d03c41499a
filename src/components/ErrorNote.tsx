import { isApiError } from '../lib/api-client';

type ErrorNoteProps = {
  error: unknown;
  /** Short context such as "Could not load the motor record". */
  title?: string;
};

/** Renders a failed request: the server's message, its stable code and its list of field problems (in server order). */
export function ErrorNote({ error, title = 'Something went wrong' }: ErrorNoteProps) {
  const apiError = isApiError(error) ? error : undefined;
  const message = apiError?.message ?? 'An unexpected problem occurred in this screen.';
  const code = apiError?.code ?? 'client_error';

  return (
    <div role="alert" className="rounded-md border border-fail/40 bg-fail-soft px-4 py-3 text-sm text-fail-ink">
      <p className="font-semibold">{title}</p>
      <p className="mt-1">{message}</p>
      {apiError && apiError.fields.length > 0 ? (
        <ul className="mt-2 list-disc pl-5">
          {apiError.fields.map(({ field, message: fieldMessage }, index) => (
            <li key={`${index}:${field}`}>
              <span className="figures">{field}</span>: {fieldMessage}
            </li>
          ))}
        </ul>
      ) : null}
      <p className="mt-2 text-xs opacity-80">
        Error code <span className="figures">{code}</span>
      </p>
    </div>
  );
}
