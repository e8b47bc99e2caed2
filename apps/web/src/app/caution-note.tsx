import { Caption1, makeStyles, tokens } from '@fluentui/react-components';

const useStyles = makeStyles({
  root: { display: 'block', color: tokens.colorNeutralForeground2, maxWidth: '110ch' },
});

/** Roundbook's standing caution (product design, "Cautions"). Shown on every signed-in page and at sign-in. */
export function CautionNote() {
  const styles = useStyles();
  return (
    <Caption1 as="p" className={styles.root} data-testid="caution-note">
      Roundbook records, computes and passes on information about the ground. It does not approve support,
      declare ground safe or stand in for the handover at the face. The responsible engineer and the competent
      person on site decide, under the project design, the contract and local rules. Nobody goes under
      unsupported ground.
    </Caption1>
  );
}
