import { makeStyles, Spinner, tokens } from '@fluentui/react-components';

const useStyles = makeStyles({
  root: { display: 'flex', justifyContent: 'center', padding: tokens.spacingVerticalXXXL },
});

export function PageLoading() {
  const styles = useStyles();
  return (
    <div className={styles.root}>
      <Spinner size="large" label="Loading…" />
    </div>
  );
}
