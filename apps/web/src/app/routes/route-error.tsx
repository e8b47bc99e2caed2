import { Button, makeStyles, tokens } from '@fluentui/react-components';
import { EmptyState, TOUCH_TARGET_PX } from '@roundbook/ui';
import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { isApiError, NETWORK_ERROR_CODE } from '@/lib/api-client';

const useStyles = makeStyles({
  root: { padding: tokens.spacingHorizontalXL, maxWidth: '60rem', marginInline: 'auto', width: '100%' },
  actions: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM, justifyContent: 'center' },
  touch: { minHeight: `${TOUCH_TARGET_PX}px` },
  link: {
    display: 'inline-flex',
    alignItems: 'center',
    minHeight: `${TOUCH_TARGET_PX}px`,
    paddingInline: tokens.spacingHorizontalM,
    color: tokens.colorBrandForegroundLink,
    fontWeight: tokens.fontWeightSemibold,
  },
});

interface Explained {
  title: string;
  message: string;
}

export function explainRouteError(error: unknown): Explained {
  if (isRouteErrorResponse(error) && error.status === 404) {
    return { title: 'No such page', message: 'The address does not lead to anything in Roundbook.' };
  }
  if (isApiError(error)) {
    if (error.code === NETWORK_ERROR_CODE) {
      return {
        title: 'Roundbook server not reachable',
        message: 'The page could not load its data. Check the connection and try again.',
      };
    }
    if (error.status === 404) {
      return {
        title: 'Not found here',
        message: 'It does not exist, or it belongs to a project you are not a member of.',
      };
    }
    if (error.status === 403) {
      return {
        title: 'Not open to your role',
        message: 'Your role in this project does not include this page.',
      };
    }
    return { title: 'The server could not answer', message: error.message };
  }
  if (
    error instanceof Error &&
    /dynamically imported module|Importing a module script failed/i.test(error.message)
  ) {
    return {
      title: 'Roundbook was updated',
      message: 'Part of this page changed on the server. Reload to get the new version.',
    };
  }
  return {
    title: 'Something went wrong on this page',
    message: 'Reload to try again. If it keeps happening, tell your project admin.',
  };
}

/** The error element of each route branch: says what happened and offers a way on. */
export function RouteError() {
  const styles = useStyles();
  const error = useRouteError();
  const { title, message } = explainRouteError(error);
  return (
    <div className={styles.root} role="alert">
      <EmptyState
        title={title}
        message={message}
        action={
          <div className={styles.actions}>
            <Button
              className={styles.touch}
              appearance="primary"
              size="large"
              onClick={() => window.location.reload()}
            >
              Reload
            </Button>
            <Link className={styles.link} to="/">
              Back to the Board
            </Link>
          </div>
        }
      />
    </div>
  );
}
