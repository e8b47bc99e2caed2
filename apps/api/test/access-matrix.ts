// Who may call each route of the API: the expected access table that access-matrix.e2e-spec.ts checks
// against the OpenAPI document. A route the document has and this table does not (or the other way round)
// fails the test, so every new route gets its row here, decided on purpose.
//
// Actors: anonymous (no token), outsider (signed in, member of nothing, not operator), operator (runs the
// instance, member of nothing), and the five project roles of one project.

export const ACTORS = [
  'anonymous',
  'outsider',
  'operator',
  'admin',
  'geologist',
  'engineer',
  'supervisor',
  'viewer',
] as const;
export type Actor = (typeof ACTORS)[number];

const ANYONE: readonly Actor[] = ACTORS;
const SIGNED_IN: readonly Actor[] = ACTORS.filter((a) => a !== 'anonymous');
const MEMBERS: readonly Actor[] = ['admin', 'geologist', 'engineer', 'supervisor', 'viewer'];
const ADMIN: readonly Actor[] = ['admin'];
const GEOLOGIST_OR_ADMIN: readonly Actor[] = ['admin', 'geologist'];
const ENGINEER_OR_ADMIN: readonly Actor[] = ['admin', 'engineer'];
const GEOLOGIST: readonly Actor[] = ['geologist'];
const ENGINEER: readonly Actor[] = ['engineer'];
const GEOLOGIST_OR_ENGINEER: readonly Actor[] = ['geologist', 'engineer'];
const OPERATOR: readonly Actor[] = ['operator'];
/** Everyone of the project but viewers (hazards are raised by whoever sees them). */
const CONTRIBUTORS: readonly Actor[] = ['admin', 'geologist', 'engineer', 'supervisor'];
/** Who may close a hazard: engineers and supervisors (and admins). */
const HAZARD_CLOSERS: readonly Actor[] = ['admin', 'engineer', 'supervisor'];
const SUPERVISOR: readonly Actor[] = ['supervisor'];
const SUPERVISOR_OR_ADMIN: readonly Actor[] = ['admin', 'supervisor'];
/** Who records support as built: the supervisor has it installed, the engineer may correct it (and admins). */
const SUPPORT_RECORDERS: readonly Actor[] = ['admin', 'engineer', 'supervisor'];

/** "METHOD /path" (as in the OpenAPI document) → the actors allowed through. */
export const EXPECTED_ACCESS: Record<string, readonly Actor[]> = {
  'GET /api/config': ANYONE,
  'GET /api/health': ANYONE,
  'GET /api/health/live': ANYONE,
  'POST /api/auth/login': ANYONE,
  'GET /api/auth/me': SIGNED_IN,
  'POST /api/auth/sign-out-everywhere': SIGNED_IN,
  'POST /api/auth/password': SIGNED_IN,

  'GET /api/projects': SIGNED_IN,
  // PROJECT_CREATION=operators (the API's default; `npm start` sets anyone for the demo).
  'POST /api/projects': OPERATOR,
  'GET /api/projects/{projectId}': MEMBERS,
  'PATCH /api/projects/{projectId}': ADMIN,
  'GET /api/projects/{projectId}/audit': MEMBERS,

  'GET /api/projects/{projectId}/headings': MEMBERS,
  'POST /api/projects/{projectId}/headings': ADMIN,
  'GET /api/projects/{projectId}/headings/{headingId}': MEMBERS,
  'PATCH /api/projects/{projectId}/headings/{headingId}': ADMIN,

  'GET /api/projects/{projectId}/support-classes': MEMBERS,
  'POST /api/projects/{projectId}/support-classes': ADMIN,
  'PUT /api/projects/{projectId}/support-classes/order': ADMIN,
  'PATCH /api/projects/{projectId}/support-classes/{classId}': ADMIN,
  'DELETE /api/projects/{projectId}/support-classes/{classId}': ADMIN,

  'GET /api/projects/{projectId}/trigger-rules': MEMBERS,
  'POST /api/projects/{projectId}/trigger-rules': ENGINEER_OR_ADMIN,
  'POST /api/projects/{projectId}/trigger-rules/preview': ENGINEER_OR_ADMIN,
  'PATCH /api/projects/{projectId}/trigger-rules/{ruleId}': ENGINEER_OR_ADMIN,
  'DELETE /api/projects/{projectId}/trigger-rules/{ruleId}': ENGINEER_OR_ADMIN,

  'GET /api/projects/{projectId}/team': MEMBERS,
  'POST /api/projects/{projectId}/invitations': ADMIN,
  'POST /api/projects/{projectId}/invitations/{invitationId}/resend': ADMIN,
  'DELETE /api/projects/{projectId}/invitations/{invitationId}': ADMIN,
  'PATCH /api/projects/{projectId}/members/{memberId}': ADMIN,
  'DELETE /api/projects/{projectId}/members/{memberId}': ADMIN,
  // The invitation's token is the permission: anyone holding the link may read it and accept it (as the
  // invited address only; invitations.e2e-spec.ts checks that).
  'GET /api/invitations/{token}': ANYONE,
  'POST /api/invitations/{token}/accept': ANYONE,

  'GET /api/projects/{projectId}/headings/{headingId}/rounds': MEMBERS,
  'POST /api/projects/{projectId}/headings/{headingId}/rounds': GEOLOGIST,
  'GET /api/projects/{projectId}/headings/{headingId}/rounds/next': GEOLOGIST,
  'GET /api/projects/{projectId}/headings/{headingId}/joints': MEMBERS,
  'GET /api/projects/{projectId}/headings/{headingId}/exports/rounds.csv': MEMBERS,
  'GET /api/projects/{projectId}/headings/{headingId}/exports/joints.csv': MEMBERS,
  'GET /api/projects/{projectId}/rounds/{roundId}': MEMBERS,
  'GET /api/projects/{projectId}/rounds/{roundId}/revisions': MEMBERS,
  'PUT /api/projects/{projectId}/rounds/{roundId}': GEOLOGIST,
  'POST /api/projects/{projectId}/rounds/{roundId}/submit': GEOLOGIST,

  // Review (issue 11): the engineer decides; a correction may be asked by the geologist or the engineer; the
  // owning role of a fired rule acknowledges it (checked on the rule: every member passes the guard).
  'GET /api/projects/{projectId}/rounds/{roundId}/review': MEMBERS,
  'POST /api/projects/{projectId}/rounds/{roundId}/confirm': ENGINEER,
  'POST /api/projects/{projectId}/rounds/{roundId}/return': ENGINEER,
  'POST /api/projects/{projectId}/rounds/{roundId}/correct': GEOLOGIST_OR_ENGINEER,
  'POST /api/projects/{projectId}/rounds/{roundId}/triggers/{ruleId}/acknowledge': MEMBERS,
  // Accepting a standing condition, and withdrawing the acceptance, is the engineer's (item 3).
  'POST /api/projects/{projectId}/rounds/{roundId}/triggers/{ruleId}/accept': ENGINEER,
  'POST /api/projects/{projectId}/rounds/{roundId}/acceptances/{acceptanceId}/withdraw': ENGINEER,
  'POST /api/projects/{projectId}/rounds/{roundId}/review/comments/{commentId}/resolve':
    GEOLOGIST_OR_ENGINEER,
  // The queue lists what the caller reviews as an engineer, across projects; empty for everyone else.
  'GET /api/review/queue': SIGNED_IN,
  // Each member chooses the review notices they receive in the project (their own choice only).
  'GET /api/projects/{projectId}/notice-settings': MEMBERS,
  'PUT /api/projects/{projectId}/notice-settings': MEMBERS,

  // Photos (issue 14): members see them; the geologist or the admin adds, edits and removes them.
  'GET /api/projects/{projectId}/rounds/{roundId}/sketch/render': MEMBERS,
  'GET /api/projects/{projectId}/rounds/{roundId}/photos': MEMBERS,
  'POST /api/projects/{projectId}/rounds/{roundId}/photos': GEOLOGIST_OR_ADMIN,
  'PUT /api/projects/{projectId}/rounds/{roundId}/photos/{photoId}/parts/{partNumber}': GEOLOGIST_OR_ADMIN,
  'POST /api/projects/{projectId}/rounds/{roundId}/photos/{photoId}/complete': GEOLOGIST_OR_ADMIN,
  'DELETE /api/projects/{projectId}/rounds/{roundId}/photos/{photoId}/upload': GEOLOGIST_OR_ADMIN,
  'GET /api/projects/{projectId}/rounds/{roundId}/photos/{photoId}': MEMBERS,
  'PATCH /api/projects/{projectId}/rounds/{roundId}/photos/{photoId}': GEOLOGIST_OR_ADMIN,
  'DELETE /api/projects/{projectId}/rounds/{roundId}/photos/{photoId}': GEOLOGIST_OR_ADMIN,
  'GET /api/projects/{projectId}/rounds/{roundId}/photos/{photoId}/url': MEMBERS,

  // Hazards (issue 15 item 1): the register of a heading.
  'GET /api/projects/{projectId}/headings/{headingId}/hazards': MEMBERS,
  'GET /api/projects/{projectId}/headings/{headingId}/long-section': MEMBERS,
  'POST /api/projects/{projectId}/headings/{headingId}/hazards': CONTRIBUTORS,
  'GET /api/projects/{projectId}/headings/{headingId}/hazards/{hazardId}': MEMBERS,
  'PATCH /api/projects/{projectId}/headings/{headingId}/hazards/{hazardId}': CONTRIBUTORS,
  'POST /api/projects/{projectId}/headings/{headingId}/hazards/{hazardId}/close': HAZARD_CLOSERS,
  // Handovers (issue 15): supervisors and admins compose and send; the incoming supervisor named on it
  // acknowledges (checked on the handover: other supervisors get 403 there); every member reads them.
  'GET /api/projects/{projectId}/handovers/draft': SUPERVISOR_OR_ADMIN,
  'POST /api/projects/{projectId}/handovers': SUPERVISOR_OR_ADMIN,
  'GET /api/projects/{projectId}/handovers/{handoverId}': MEMBERS,
  'GET /api/projects/{projectId}/handovers/{handoverId}/pdf': MEMBERS,
  'POST /api/projects/{projectId}/handovers/{handoverId}/acknowledge': SUPERVISOR,
  'GET /api/projects/{projectId}/headings/{headingId}/handovers': MEMBERS,
  // Handovers addressed to the caller, across their projects; empty for everyone else.
  'GET /api/handovers/received': SIGNED_IN,

  // Support as built (issue 15 item 2): members read the checklist; geologists and viewers do not record.
  'GET /api/projects/{projectId}/rounds/{roundId}/support-record': MEMBERS,
  'PUT /api/projects/{projectId}/rounds/{roundId}/support-record': SUPPORT_RECORDERS,

  // Local mode only (the test app runs in it); the instance operator alone.
  'GET /api/local/access': SIGNED_IN,
  'GET /api/local/mail': OPERATOR,
  'GET /api/local/mail/{id}/attachments/{index}': OPERATOR,
  'GET /api/local/jobs': OPERATOR,
  'POST /api/local/jobs/{jobId}/retry': OPERATOR,
};

// The role sets, exported so a new row can use them.
export const ROLE_SETS = {
  ANYONE,
  SIGNED_IN,
  MEMBERS,
  ADMIN,
  GEOLOGIST_OR_ADMIN,
  ENGINEER_OR_ADMIN,
  GEOLOGIST,
  OPERATOR,
  CONTRIBUTORS,
  HAZARD_CLOSERS,
  SUPERVISOR,
  SUPERVISOR_OR_ADMIN,
  SUPPORT_RECORDERS,
};
