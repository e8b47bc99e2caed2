import {
  Badge,
  Button,
  makeStyles,
  MessageBar,
  MessageBarActions,
  MessageBarBody,
  MessageBarTitle,
  Tab,
  TabList,
  tokens,
} from '@fluentui/react-components';
import type { RoundAssessment, RoundRecordInput, SketchDocument } from '@roundbook/domain';
import { formatChainage } from '@roundbook/geomath';
import type { JvEdition } from '@roundbook/geomath';
import { PageHeader } from '@roundbook/ui';
import { Formik, useFormikContext } from 'formik';
import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import { submitRound } from '@/api/resources/rounds';
import { useNearbyJoints, useRoundTriggerRules } from '@/features/rounds/api/get-round';
import type { HeadingDetail, ProjectDetail, Round, SupportClass } from '@/features/rounds/api/types';
import { RoundConflictView } from '@/features/rounds/components/conflict-view';
import { GroundSection } from '@/features/rounds/components/ground-section';
import { JointsSection } from '@/features/rounds/components/joints-section';
import { PositionSection } from '@/features/rounds/components/position-section';
import { RatingSection } from '@/features/rounds/components/rating-section';
import { RoundEditContext } from '@/features/rounds/components/round-fields';
import {
  GroundSummary,
  JointsSummary,
  PositionSummary,
  RatingSummary,
  SupportSummary,
} from '@/features/rounds/components/round-summary';
import { SaveStateBadge } from '@/features/rounds/components/save-state';
import { SupportSection } from '@/features/rounds/components/support-section';
import { TriggerPanel } from '@/features/rounds/components/trigger-panel';
import { useCarriedInputs } from '@/features/rounds/hooks/use-carried-inputs';
import type { RoundAutosave } from '@/features/rounds/hooks/use-round-autosave';
import { useRoundAutosave } from '@/features/rounds/hooks/use-round-autosave';
import type { RoundFormValues } from '@/features/rounds/schemas/round-form';
import { chainageOf, roundFormSchema } from '@/features/rounds/schemas/round-form';
import { assessmentRecordOf, liveAssessment } from '@/features/rounds/utils/assessment';
import { stageLabels, statusLabels } from '@/features/rounds/utils/labels';
import { isApiError } from '@/lib/api-client';

export const ROUND_SECTIONS = ['position', 'ground', 'joints', 'rating', 'support'] as const;
export type RoundSection = (typeof ROUND_SECTIONS)[number] | 'sketch';
/** The sections with the Sketch (when app/routes gives one): after the joints it is linked to. */
const SECTIONS_WITH_SKETCH: readonly RoundSection[] = [
  'position',
  'ground',
  'joints',
  'sketch',
  'rating',
  'support',
];

const sectionLabels: Record<RoundSection, string> = {
  position: 'Position',
  ground: 'Ground',
  joints: 'Joints',
  sketch: 'Sketch',
  rating: 'Rating',
  support: 'Support',
};

/** Which section an API field name belongs to (save and submit answers). */
export function sectionOfField(field: string): RoundSection {
  const head = field.split('.')[0];
  if (head === 'ground') return 'ground';
  if (head === 'joints') return 'joints';
  if (head === 'sketch') return 'sketch';
  if (['ratings', 'qInput', 'rmrInput', 'gsiObserved'].includes(head)) return 'rating';
  if (['recommendedClassId', 'nextRoundLength', 'recommendationReason'].includes(head)) return 'support';
  return 'position';
}

export interface RoundEditorProps {
  projectId: string;
  round: Round;
  project: ProjectDetail;
  heading: HeadingDetail;
  supportClasses: SupportClass[];
  /** The person may edit rounds (geologist); the round's status decides the rest. */
  canEdit: boolean;
  initialSection?: RoundSection;
  /** Asks to show a section (a new `seq` each time), e.g. the sketch when a photo is to be pinned on it. */
  sectionRequest?: { section: RoundSection; seq: number };
  /** Told when the section shown changes (the route keeps it in the address, so a reload stays on it). */
  onSectionChange?: (section: RoundSection) => void;
  /**
   * Shown under the joints: the round as typed (its readable joints and the live assessment), e.g. the
   * orientation panel that app/routes composes from its own feature.
   */
  orientationSlot?: (live: {
    joints: RoundRecordInput['joints'];
    assessment: RoundAssessment;
    faceChainage: number;
    /**
     * Put joints (by id) in a set, or out of every set (null), as the geologist's own choice (setLabel with
     * setOverride, as the Joints list's set field writes them; saved as you go). Null when read only.
     */
    assignSets: ((ids: string[], label: string | null) => void) | null;
  }) => ReactNode;
  /**
   * The Sketch section (app/routes composes it from its own feature): the round's sketch document as typed,
   * a setter that puts a new one into the round (saved with it as you go), and the joints as typed.
   */
  sketchSlot?: (live: {
    sketch: SketchDocument;
    onChange: (sketch: SketchDocument) => void;
    readOnly: boolean;
    joints: { id: string; seq: number; orientationText: string; setLabel: string | null }[];
    assessment: RoundAssessment;
    faceChainage: number;
  }) => ReactNode;
  /**
   * Notes that concern a section (app/routes composes them, e.g. the review's open return comments), shown
   * at the top of that section; 'round' is shown above the sections (comments on the round as a whole).
   */
  sectionNoteSlot?: (section: RoundSection | 'round') => ReactNode;
}

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', rowGap: tokens.spacingVerticalL },
  nav: {
    position: 'sticky',
    top: 0,
    zIndex: 2,
    backgroundColor: tokens.colorNeutralBackground2,
    borderRadius: tokens.borderRadiusLarge,
    padding: tokens.spacingHorizontalXS,
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'center',
    justifyContent: 'space-between',
    gap: tokens.spacingHorizontalM,
  },
  tab: {
    minHeight: '56px',
    minWidth: '8.5rem',
    fontSize: tokens.fontSizeBase500,
    justifyContent: 'center',
  },
  dot: { marginInlineStart: tokens.spacingHorizontalXS },
  saveState: { paddingInline: tokens.spacingHorizontalS },
});

/** The sets the round was saved (or frozen at submit) with, when its stored assessment has them. */
function frozenSets(round: Round): RoundAssessment['sets'] | null {
  const sets = (round.assessment as Partial<RoundAssessment>).sets;
  return sets && Array.isArray(sets.sets) ? sets : null;
}

/** The Round screen: five short sections behind big tabs, saved as you go, submitted from Support. */
export function RoundEditor(props: RoundEditorProps) {
  const { projectId, round, supportClasses, canEdit, heading } = props;
  const classCode = useCallback(
    (id: string) => supportClasses.find((c) => c.id === id)?.code ?? id,
    [supportClasses],
  );
  const autosave = useRoundAutosave({
    projectId,
    initial: round,
    canEdit,
    classCode,
    chainage: { style: heading.chainageStyle, decimals: heading.chainageDecimals },
  });
  return (
    <Formik<RoundFormValues>
      initialValues={autosave.initialValues}
      validationSchema={roundFormSchema}
      validateOnBlur
      validateOnChange
      onSubmit={() => undefined}
    >
      <RoundEditorBody {...props} autosave={autosave} />
    </Formik>
  );
}

function RoundEditorBody({
  projectId,
  round,
  project,
  heading,
  supportClasses,
  canEdit,
  initialSection,
  sectionRequest,
  onSectionChange,
  orientationSlot,
  sketchSlot,
  sectionNoteSlot,
  autosave,
}: RoundEditorProps & { autosave: RoundAutosave }) {
  const styles = useStyles();
  const { values, resetForm, setFieldValue } = useFormikContext<RoundFormValues>();
  const [section, setSection] = useState<RoundSection>(initialSection ?? 'position');
  // A request from outside (the photos' "Pin on the sketch") switches once per seq (state adjusted while rendering).
  const [requestSeen, setRequestSeen] = useState(sectionRequest?.seq ?? 0);
  if (sectionRequest && sectionRequest.seq !== requestSeen) {
    setRequestSeen(sectionRequest.seq);
    setSection(sectionRequest.section);
  }
  useEffect(() => onSectionChange?.(section), [onSectionChange, section]);
  const [submitErrors, setSubmitErrors] = useState<Record<string, string>>({});
  const [submitMessage, setSubmitMessage] = useState<string | null>(null);
  const [submitting, setSubmitting] = useState(false);
  // Submit sits at the foot of Support; the note that it went through is above the sections. Focus moves to
  // it as it shows (the Submit button that had it is gone), which brings it into sight: nobody scrolls back
  // up to learn whether the round was submitted. In a layout effect, before the focus manager would hand
  // the lost focus on (and scroll to wherever that is).
  const submittedNote = useRef<HTMLDivElement>(null);
  const [justSubmitted, setJustSubmitted] = useState(false);

  // Every change goes to the autosave engine: kept on this device at once, sent after a pause.
  const { edit } = autosave;
  useEffect(() => edit(values), [edit, values]);
  const takeTheirs = () => {
    const theirs = autosave.takeTheirs();
    if (theirs !== null) resetForm({ values: theirs });
  };
  const server = autosave.server;
  useLayoutEffect(() => {
    if (justSubmitted && server.status === 'submitted') submittedNote.current?.focus();
  }, [justSubmitted, server.status]);
  const changedBy = autosave.changedBy;
  // Another device saved and nothing was unsaved here: their version goes into the form.
  const refreshed = autosave.refreshed;
  useEffect(() => {
    if (refreshed !== null) resetForm({ values: refreshed.document });
  }, [refreshed, resetForm]);
  const readOnly = !canEdit || !(server.status === 'draft' || server.status === 'returned');

  const face = chainageOf(values.faceChainage) ?? server.faceChainage;
  const distance = values.setParameters.windowM;
  const nearby = useNearbyJoints(
    projectId,
    heading.id,
    { fromChainage: face - distance, toChainage: face + distance, excludeRoundId: round.id },
    distance > 0,
  );
  const nearbyJoints = useMemo(() => (distance > 0 ? (nearby.data ?? []) : []), [distance, nearby.data]);
  const triggerRules = useRoundTriggerRules(projectId);
  const rules = triggerRules.data;
  // One assessment of the round as typed (packages/domain, as the API runs it on save): the Rating tab,
  // the sets and the trigger level all read it.
  const assessment = useMemo(
    () =>
      liveAssessment(values, {
        round: server,
        project,
        heading,
        supportClasses,
        nearbyJoints,
        rules: rules ?? [],
      }),
    [values, server, project, heading, supportClasses, nearbyJoints, rules],
  );

  // Is50, RQD, spacing and inflow typed in Ground and Joints, carried into the rating inputs.
  const [jvEdition, setJvEdition] = useState<JvEdition>(1982);
  const carried = useCarriedInputs({
    sets: assessment.sets.sets,
    inflowPer10m: assessment.inflowPer10m,
    readOnly,
    jvEdition,
  });

  const serverErrors = { ...autosave.fieldErrors, ...submitErrors };
  const errorSections = new Set(Object.keys(serverErrors).map(sectionOfField));
  const chainageStyle = { style: heading.chainageStyle, decimals: heading.chainageDecimals };

  const go = (next: RoundSection) => {
    setSection(next);
    void autosave.flush();
  };

  const submit = async () => {
    setSubmitting(true);
    setSubmitMessage(null);
    setSubmitErrors({});
    try {
      await autosave.flush();
      const submitted = await submitRound(projectId, round.id, autosave.version());
      autosave.accept(submitted);
      setJustSubmitted(true);
    } catch (error) {
      if (isApiError(error) && error.fields !== undefined && Object.keys(error.fields).length > 0) {
        setSubmitErrors(error.fields);
        setSubmitMessage(`${error.message} The marked sections say what is missing.`);
        const first = Object.keys(error.fields).map(sectionOfField)[0];
        if (first !== undefined && first !== 'support') setSection(first);
      } else {
        setSubmitMessage(isApiError(error) ? error.message : 'The round could not be submitted. Try again.');
      }
    } finally {
      setSubmitting(false);
    }
  };

  return (
    <RoundEditContext.Provider value={{ readOnly, serverErrors }}>
      <div className={styles.root}>
        <PageHeader
          title={`Round ${server.roundNumber} · ${heading.code} · ${formatChainage(server.faceChainage, chainageStyle)}`}
          subtitle={`${heading.name} · ${stageLabels[server.stage]} · ${project.name}`}
          actions={
            <>
              <Badge
                size="extra-large"
                appearance="tint"
                shape="rounded"
                color={server.status === 'draft' ? 'informative' : 'brand'}
              >
                {statusLabels[server.status]}
              </Badge>
              {server.status === 'confirmed' && server.confirmedClassId !== null ? (
                <Badge
                  size="extra-large"
                  appearance="filled"
                  shape="rounded"
                  color="brand"
                  data-testid="confirmed-class"
                >
                  {`Class ${supportClasses.find((c) => c.id === server.confirmedClassId)?.code ?? '?'} confirmed`}
                </Badge>
              ) : null}
            </>
          }
        />

        {/* A round that is no longer a draft shows what it was submitted with, never a recomputation. */}
        {rules === undefined || readOnly ? (
          <TriggerPanel
            level={server.triggerLevel}
            firings={server.triggerFirings}
            notEvaluated={server.triggersNotEvaluated}
            accepted={(server.assessment as Partial<RoundAssessment>).triggers?.accepted}
          />
        ) : (
          <TriggerPanel
            level={assessment.triggers.level}
            firings={assessment.triggers.firings}
            notEvaluated={assessment.triggers.notEvaluated}
            accepted={assessment.triggers.accepted}
            live
          />
        )}

        {autosave.state === 'offline' && (
          <MessageBar intent="warning" data-testid="offline-note">
            <MessageBarBody>
              <MessageBarTitle>Not saved yet — will retry</MessageBarTitle>
              The server cannot be reached. Your typing is kept on this device and is sent as soon as the
              connection is back.
            </MessageBarBody>
            <MessageBarActions>
              <Button size="large" onClick={() => void autosave.flush()}>
                Try now
              </Button>
            </MessageBarActions>
          </MessageBar>
        )}
        {autosave.state === 'error' && autosave.message !== null && (
          <MessageBar intent="error" data-testid="save-error">
            <MessageBarBody>
              <MessageBarTitle>Not saved</MessageBarTitle>
              {autosave.message} Your typing is kept on this device.
            </MessageBarBody>
          </MessageBar>
        )}
        {autosave.restored !== null && (
          <MessageBar intent="info" data-testid="restored-note">
            <MessageBarBody>{autosave.restored}</MessageBarBody>
            <MessageBarActions>
              <Button size="large" onClick={autosave.dismissRestored}>
                OK
              </Button>
            </MessageBarActions>
          </MessageBar>
        )}
        {refreshed !== null && (
          <MessageBar intent="info" data-testid="refreshed-note">
            <MessageBarBody>
              <MessageBarTitle>Updated from another device</MessageBarTitle>
              {`${refreshed.by ?? 'Someone'} saved this round`}
              {refreshed.fields.length > 0 ? ` (changed: ${refreshed.fields.join(', ')})` : ''}
              {'. The form now shows that version; you had nothing unsaved.'}
            </MessageBarBody>
            <MessageBarActions>
              <Button size="large" onClick={autosave.dismissRefreshed}>
                OK
              </Button>
            </MessageBarActions>
          </MessageBar>
        )}
        {autosave.conflict !== null && autosave.conflict.state === 'choose' && !readOnly && (
          <RoundConflictView
            message={autosave.conflict.message}
            changedBy={changedBy}
            base={autosave.conflict.base}
            mine={values}
            theirs={autosave.conflict.theirs}
            onApply={(merged) => {
              const doc = autosave.resolve(merged);
              if (doc !== null) resetForm({ values: doc });
            }}
            onTakeTheirs={takeTheirs}
          />
        )}
        {autosave.conflict !== null && autosave.conflict.state !== 'choose' && (
          <MessageBar intent="success" data-testid="conflict-settled">
            <MessageBarBody>
              {autosave.conflict.state === 'kept'
                ? 'Merged with their version; the merge is being saved.'
                : 'Their version is now in the form.'}
            </MessageBarBody>
            <MessageBarActions>
              <Button size="large" onClick={autosave.dismissStale}>
                OK
              </Button>
            </MessageBarActions>
          </MessageBar>
        )}
        {server.status === 'submitted' && (
          <MessageBar intent="success" data-testid="submitted-note" ref={submittedNote} tabIndex={-1}>
            <MessageBarBody>
              Submitted for review. The engineers of the project confirm it or return it; until then it cannot
              be edited.
            </MessageBarBody>
          </MessageBar>
        )}

        {sectionNoteSlot?.('round')}
        <div className={styles.nav}>
          <TabList
            size="large"
            selectedValue={section}
            onTabSelect={(_e, data) => go(data.value as RoundSection)}
            aria-label="Sections of the round"
          >
            {(sketchSlot ? SECTIONS_WITH_SKETCH : ROUND_SECTIONS).map((s) => (
              <Tab key={s} value={s} className={styles.tab}>
                {sectionLabels[s]}
                {errorSections.has(s) && (
                  <Badge className={styles.dot} color="danger" size="small" aria-label="needs attention">
                    !
                  </Badge>
                )}
              </Tab>
            ))}
          </TabList>
          {/* In the sticky bar, not the page header: the save state stays in sight however far down the
              section is typed (issue 19: a round recorded without scrolling back up to see it). */}
          <div className={styles.saveState}>
            <SaveStateBadge state={autosave.state} invalid={autosave.invalid} readOnly={readOnly} />
          </div>
        </div>

        {sectionNoteSlot?.(section)}
        {/* A round that cannot be edited reads as a summary, not as a disabled form (issue 19 item 11). */}
        {readOnly && section === 'position' && (
          <PositionSummary round={server} heading={heading} timeZone={project.timeZone} />
        )}
        {readOnly && section === 'ground' && (
          <GroundSummary groundScale={project.groundScale} inflowPer10m={assessment.inflowPer10m} />
        )}
        {readOnly && section === 'joints' && <JointsSummary sets={frozenSets(server) ?? assessment.sets} />}
        {readOnly && section === 'rating' && <RatingSummary saved={server.ratings} />}
        {readOnly && section === 'support' && (
          <SupportSummary classes={supportClasses} suggestedClassIds={server.suggestedClassIds} />
        )}
        {!readOnly && section === 'position' && (
          <PositionSection round={server} chainage={chainageStyle} timeZone={project.timeZone} />
        )}
        {!readOnly && section === 'ground' && (
          <GroundSection groundScale={project.groundScale} inflowPer10m={assessment.inflowPer10m} />
        )}
        {!readOnly && section === 'joints' && (
          <JointsSection
            defaultNotation={project.defaultNotation}
            sets={assessment.sets}
            distance={distance}
            onDistanceChange={(windowM) => void setFieldValue('setParameters.windowM', windowM)}
            setCount={values.setParameters.count}
            onSetCountChange={(count) => void setFieldValue('setParameters.count', count)}
            nearbyCount={nearbyJoints.length}
            nearbyLoading={distance > 0 && nearby.isLoading}
            featureSource={{
              projectId,
              headingId: heading.id,
              roundId: round.id,
              faceChainage: face,
              chainage: (m) => formatChainage(m, chainageStyle),
            }}
          />
        )}
        {section === 'joints' &&
          orientationSlot?.({
            joints: assessmentRecordOf(values, server.faceChainage).joints,
            assessment,
            faceChainage: face,
            assignSets: readOnly
              ? null
              : (ids, label) => {
                  const chosen = new Set(ids);
                  void setFieldValue(
                    'joints',
                    values.joints.map((j) =>
                      chosen.has(j.key) ? { ...j, setLabel: label ?? '', setOverride: true } : j,
                    ),
                  );
                },
          })}
        {section === 'sketch' &&
          sketchSlot?.({
            sketch: values.sketch,
            onChange: (sketch) => void setFieldValue('sketch', sketch),
            readOnly,
            joints: values.joints.map((j, i) => ({
              id: j.key,
              seq: i + 1,
              orientationText: j.orientationText,
              setLabel: assessment.sets.membership[j.key] || j.setLabel || null,
            })),
            assessment,
            faceChainage: face,
          })}
        {!readOnly && section === 'rating' && (
          <RatingSection
            live={assessment.ratings}
            saved={server.ratings}
            sets={assessment.sets.sets}
            inflowPer10m={assessment.inflowPer10m}
            driveTrend={heading.driveTrend}
            carried={carried}
            jvEdition={jvEdition}
            onJvEditionChange={setJvEdition}
          />
        )}
        {!readOnly && section === 'support' && (
          <SupportSection
            classes={supportClasses}
            suggestedClassIds={server.suggestedClassIds}
            suggestion={assessment.suggestion}
            plannedRoundLength={server.plannedRoundLength}
            canSubmit={!readOnly}
            submitting={submitting}
            submitMessage={submitMessage}
            onSubmit={() => void submit()}
          />
        )}
      </div>
    </RoundEditContext.Provider>
  );
}
