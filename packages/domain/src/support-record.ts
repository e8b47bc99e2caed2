// Support as built (product.md "Support record"): the checklist of one confirmed round, what its class
// plans for each element and what the crew installed. The words, the units, the plan read from a support
// class and the checks of one item live here, so the API (on write), the browser (in the form) and the
// handover read them alike.

/** The elements of ground support a round's checklist lists, in the order the crew usually works. */
export const SUPPORT_ELEMENTS = [
  'probe-holes',
  'sprayed-concrete',
  'mesh',
  'bolts',
  'spiles',
  'steel-sets',
] as const;
export type SupportElement = (typeof SUPPORT_ELEMENTS)[number];

export const supportElementLabels: Record<SupportElement, string> = {
  'probe-holes': 'Probe holes',
  'sprayed-concrete': 'Sprayed concrete',
  mesh: 'Mesh',
  bolts: 'Rock bolts',
  spiles: 'Spiles',
  'steel-sets': 'Steel sets or lattice girders',
};

/** What one item's quantity counts, and whether a length (m) goes with it. */
export const SUPPORT_UNITS = ['count', 'mm', 'm2'] as const;
export type SupportUnit = (typeof SUPPORT_UNITS)[number];
export const supportUnitLabels: Record<SupportUnit, string> = { count: 'no.', mm: 'mm', m2: 'm²' };

export interface SupportElementRule {
  unit: SupportUnit;
  /** What the quantity is, in words for a form label. */
  quantityLabel: string;
  /** Largest quantity accepted for one round (a typo guard, common practice; not a design limit). */
  maxQuantity: number;
  /** Whether the item carries a length in metres (bolts, spiles, probe holes). */
  hasLength: boolean;
  maxLength: number;
}

/** Per element: unit and bounds. The bounds only catch slips of the finger; the design is the class. */
export const supportElementRules: Record<SupportElement, SupportElementRule> = {
  'probe-holes': {
    unit: 'count',
    quantityLabel: 'Holes drilled',
    maxQuantity: 50,
    hasLength: true,
    maxLength: 200,
  },
  'sprayed-concrete': {
    unit: 'mm',
    quantityLabel: 'Thickness sprayed',
    maxQuantity: 1000,
    hasLength: false,
    maxLength: 0,
  },
  mesh: { unit: 'm2', quantityLabel: 'Area meshed', maxQuantity: 5000, hasLength: false, maxLength: 0 },
  bolts: {
    unit: 'count',
    quantityLabel: 'Bolts installed',
    maxQuantity: 500,
    hasLength: true,
    maxLength: 20,
  },
  spiles: {
    unit: 'count',
    quantityLabel: 'Spiles installed',
    maxQuantity: 500,
    hasLength: true,
    maxLength: 20,
  },
  'steel-sets': {
    unit: 'count',
    quantityLabel: 'Sets installed',
    maxQuantity: 50,
    hasLength: false,
    maxLength: 0,
  },
};

/** An item is done, still to do, or not needed on this round (with the reason). */
export const SUPPORT_ITEM_STATUSES = ['done', 'outstanding', 'not-needed'] as const;
export type SupportItemStatus = (typeof SUPPORT_ITEM_STATUSES)[number];
export const supportItemStatusLabels: Record<SupportItemStatus, string> = {
  done: 'Done',
  outstanding: 'Outstanding',
  'not-needed': 'Not needed',
};

/** The support class fields the plan is read from (the library's columns). */
export interface SupportClassPlanInput {
  code: string;
  boltType: string;
  boltLength: number | null;
  boltPattern: string;
  shotcreteMm: number;
  steelSupport: string;
  probingRequired: boolean;
}

/** What the class plans for one element: whether it is part of the class at all, and what is known of it. */
export interface PlannedSupport {
  element: SupportElement;
  /** The class names this element. */
  inClass: boolean;
  /** A planned quantity in the element's unit, when the class gives one (sprayed concrete's thickness). */
  quantity: number | null;
  /** A planned length, m (bolts). */
  length: number | null;
  /** The class's own words for it (bolt type and pattern, the steel support). */
  text: string;
}

/**
 * The plan of a class, element by element. The library keeps bolts (type, length, pattern), the sprayed
 * concrete thickness, steel sets or lattice girders in words, and whether probing is required; spiles and
 * mesh are not columns of the library, so they are never planned from it (the class's notes may ask for
 * them: the person recording decides).
 */
export function plannedSupport(c: SupportClassPlanInput): PlannedSupport[] {
  const boltText = [c.boltType.trim(), c.boltPattern.trim()].filter(Boolean).join(', ');
  return SUPPORT_ELEMENTS.map((element): PlannedSupport => {
    switch (element) {
      case 'bolts':
        return {
          element,
          inClass: boltText !== '' || c.boltLength !== null,
          quantity: null,
          length: c.boltLength,
          text: boltText,
        };
      case 'sprayed-concrete':
        return {
          element,
          inClass: c.shotcreteMm > 0,
          quantity: c.shotcreteMm > 0 ? c.shotcreteMm : null,
          length: null,
          text: c.shotcreteMm > 0 ? `${c.shotcreteMm} mm` : '',
        };
      case 'steel-sets':
        return {
          element,
          inClass: c.steelSupport.trim() !== '',
          quantity: null,
          length: null,
          text: c.steelSupport.trim(),
        };
      case 'probe-holes':
        return {
          element,
          inClass: c.probingRequired,
          quantity: null,
          length: null,
          text: c.probingRequired ? 'Probing required' : '',
        };
      case 'spiles':
      case 'mesh':
        return { element, inClass: false, quantity: null, length: null, text: '' };
    }
  });
}

/** The reason given to an element the class does not name, when the checklist is first filled in. */
export const notInClassReason = (classCode: string): string => `Not an element of class ${classCode}.`;

/** One item as recorded (what the form sends and the API stores). */
export interface SupportItemInput {
  element: SupportElement;
  status: SupportItemStatus;
  /** Installed quantity in the element's unit; null when nothing is installed yet. */
  quantity: number | null;
  /** Installed length, m, for elements with a length; null otherwise. */
  length: number | null;
  /** Why the item is not needed (required then), or a note on an outstanding one. */
  reason: string;
}

/** Field → message for one item ({} when it is fine). Keys: quantity, length, reason, status. */
export function supportItemErrors(
  item: SupportItemInput,
): Partial<Record<'quantity' | 'length' | 'reason', string>> {
  const rule = supportElementRules[item.element];
  const label = supportElementLabels[item.element];
  const errors: Partial<Record<'quantity' | 'length' | 'reason', string>> = {};
  const unit = supportUnitLabels[rule.unit];
  if (item.quantity !== null) {
    if (!Number.isFinite(item.quantity) || item.quantity < 0)
      errors.quantity = `${label}: give a quantity of 0 or more (${unit}).`;
    else if (rule.unit === 'count' && !Number.isInteger(item.quantity))
      errors.quantity = `${label}: count whole pieces (no fractions).`;
    else if (item.quantity > rule.maxQuantity)
      errors.quantity = `${label}: ${item.quantity} ${unit} is more than one round takes (at most ${rule.maxQuantity} ${unit}); check the figure.`;
  }
  if (item.length !== null) {
    if (!rule.hasLength) errors.length = `${label} carry no length; leave it empty.`;
    else if (!Number.isFinite(item.length) || item.length <= 0)
      errors.length = `${label}: give the length in metres, more than 0.`;
    else if (item.length > rule.maxLength)
      errors.length = `${label}: ${item.length} m is longer than ${rule.maxLength} m; check the figure.`;
  }
  if (item.status === 'done') {
    if (!errors.quantity && (item.quantity === null || item.quantity === 0))
      errors.quantity = `${label}: say how much was installed before marking it done.`;
    if (rule.hasLength && !errors.length && item.length === null)
      errors.length = `${label}: give the installed length before marking it done.`;
  }
  if (item.status === 'not-needed' && item.reason.trim().length < 3)
    errors.reason = `${label}: say why it is not needed on this round.`;
  return errors;
}

/** One outstanding item of support as built, as the handover lists it (one line, words a supervisor reads). */
export function outstandingSupportLine(o: {
  roundNumber: number;
  stageLabel: string;
  classCode: string | null;
  element: SupportElement;
  planned: { quantity: number | null; length: number | null; text: string };
  quantity: number | null;
  length: number | null;
  reason: string;
}): string {
  const plannedQuantity =
    o.planned.quantity !== null
      ? formatSupportQuantity(o.element, o.planned.quantity, o.planned.length)
      : o.planned.length !== null
        ? `${o.planned.length} m long`
        : '';
  const plan = [o.planned.text, plannedQuantity].filter(Boolean).join(', ');
  const installed =
    o.quantity === null
      ? 'nothing recorded'
      : `${formatSupportQuantity(o.element, o.quantity, o.length)} installed`;
  const cls = o.classCode ? `, class ${o.classCode}` : '';
  return `Round ${o.roundNumber} (${o.stageLabel}${cls}): ${supportElementLabels[o.element]} — ${plan ? `planned ${plan}; ` : ''}${installed}${o.reason ? ` (${o.reason})` : ''}`;
}

/** An installed quantity with its unit, for lists and the handover: "12 no. × 3 m", "50 mm", "24 m²". */
export function formatSupportQuantity(
  element: SupportElement,
  quantity: number | null,
  length: number | null,
): string {
  if (quantity === null) return '—';
  const rule = supportElementRules[element];
  const base = `${quantity} ${supportUnitLabels[rule.unit]}`;
  return rule.hasLength && length !== null ? `${base} × ${length} m` : base;
}
