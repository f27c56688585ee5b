import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { Notice } from '@/components/ui/notice.tsx';
import { paths } from '@/config/paths.ts';

/** Shown when a page fails to render or a route does not exist. */
export function RouteError() {
  const error = useRouteError();
  return <ErrorPage notFound={isRouteErrorResponse(error) && error.status === 404} />;
}

export function NotFoundRoute() {
  return <ErrorPage notFound />;
}

function ErrorPage({ notFound }: { notFound: boolean }) {
  return (
    <div className="mx-auto max-w-xl p-8">
      <Notice
        tone={notFound ? 'caution' : 'fault'}
        title={notFound ? 'There is no page here' : 'This page failed to show'}
      >
        <p>
          {notFound
            ? 'The address may be mistyped, or the page has moved.'
            : 'Nothing you saved is lost. Reload the page; if it keeps happening, tell the workshop admin.'}
        </p>
        <p className="mt-3">
          <Link className="underline" to={paths.conversions.getHref()}>
            Back to conversions
          </Link>
        </p>
      </Notice>
    </div>
  );
}
