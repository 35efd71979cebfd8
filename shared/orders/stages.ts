import { AppError } from '../errors.ts';

/**
 * The one state machine for orders and their items, used by the server to move them and by the
 * client to show what may happen next. Money moves per order, work per item.
 */
export const ORDER_STATUSES = ['awaiting_payment', 'paid', 'fulfilled', 'cancelled', 'refunded'] as const;
export type OrderStatus = (typeof ORDER_STATUSES)[number];

export const ORDER_TRANSITIONS: Record<OrderStatus, readonly OrderStatus[]> = {
  awaiting_payment: ['paid', 'cancelled'],
  paid: ['fulfilled', 'cancelled', 'refunded'],
  fulfilled: ['refunded'],
  cancelled: [],
  refunded: [],
};

/** `unpaid` until the order is paid; `cancelled` when its order is. */
export const ITEM_STAGES = [
  'unpaid',
  'photo_review',
  'needs_new_photo',
  'prep',
  'proof_sent',
  'changes_requested',
  'approved',
  'in_production',
  'burned',
  'shipped',
  'picked_up',
  'cancelled',
] as const;
export type ItemStage = (typeof ITEM_STAGES)[number];

export const ITEM_TRANSITIONS: Record<ItemStage, readonly ItemStage[]> = {
  unpaid: ['photo_review', 'cancelled'],
  photo_review: ['needs_new_photo', 'prep', 'cancelled'],
  needs_new_photo: ['photo_review', 'cancelled'],
  prep: ['proof_sent', 'approved', 'cancelled'],
  proof_sent: ['approved', 'changes_requested', 'cancelled'],
  changes_requested: ['prep', 'cancelled'],
  approved: ['in_production', 'prep', 'cancelled'],
  in_production: ['burned', 'approved'],
  burned: ['shipped', 'picked_up'],
  shipped: [],
  picked_up: [],
  cancelled: [],
};

/**
 * What people do to an item, each a move of the machine above from the stages where that action
 * makes sense: two actions may share a target (approving a photo and reopening prep both lead to
 * prep) but not their starting points. Payment and cancellation move items too, by the table.
 */
export const ITEM_ACTIONS = {
  approvePhoto: { from: ['photo_review'], to: 'prep' },
  askNewPhoto: { from: ['photo_review'], to: 'needs_new_photo' },
  receiveNewPhoto: { from: ['needs_new_photo'], to: 'photo_review' },
  sendProof: { from: ['prep'], to: 'proof_sent' },
  approveWithoutProof: { from: ['prep'], to: 'approved' },
  approveProof: { from: ['proof_sent'], to: 'approved' },
  requestChanges: { from: ['proof_sent'], to: 'changes_requested' },
  reopenPrep: { from: ['changes_requested', 'approved'], to: 'prep' },
  startProduction: { from: ['approved'], to: 'in_production' },
  takeOutOfBatch: { from: ['in_production'], to: 'approved' },
  markBurned: { from: ['in_production'], to: 'burned' },
  ship: { from: ['burned'], to: 'shipped' },
  handOverAtPickup: { from: ['burned'], to: 'picked_up' },
} as const satisfies Record<string, { from: readonly ItemStage[]; to: ItemStage }>;
export type ItemAction = keyof typeof ITEM_ACTIONS;

const words = (stage: string) => stage.replaceAll('_', ' ');

/**
 * Refuses an action from a stage it does not start from, with 409: the state machine's own
 * message when the move itself is illegal, otherwise where the action can be done.
 */
export function assertItemAction(action: ItemAction, stage: ItemStage): void {
  const { from, to } = ITEM_ACTIONS[action];
  if ((from as readonly ItemStage[]).includes(stage)) return;
  assertMove('item', ITEM_TRANSITIONS, stage, to);
  throw new AppError('CONFLICT', `This item is ${words(stage)}: that can be done only while it is ${from.map(words).join(' or ')}.`);
}

/** How the buyer and the studio read each stage. */
export const ITEM_STAGE_LABELS: Record<ItemStage, string> = {
  unpaid: 'Waiting for payment',
  photo_review: 'Photo being checked',
  needs_new_photo: 'New photo needed',
  prep: 'Being prepared',
  proof_sent: 'Proof sent',
  changes_requested: 'Changes requested',
  approved: 'Approved for engraving',
  in_production: 'Being engraved',
  burned: 'Engraved',
  shipped: 'Shipped',
  picked_up: 'Picked up',
  cancelled: 'Cancelled',
};

export const ORDER_STATUS_LABELS: Record<OrderStatus, string> = {
  awaiting_payment: 'Waiting for payment',
  paid: 'Paid',
  fulfilled: 'Complete',
  cancelled: 'Cancelled',
  refunded: 'Refunded',
};

export const canMove = <S extends string>(transitions: Record<S, readonly S[]>, from: S, to: S) => transitions[from].includes(to);

/** Refuses an illegal move with 409 and the moves that are allowed from here. */
export function assertMove<S extends string>(what: string, transitions: Record<S, readonly S[]>, from: S, to: S): void {
  if (canMove(transitions, from, to)) return;
  const allowed = transitions[from];
  throw new AppError(
    'CONFLICT',
    `This ${what} is ${from.replaceAll('_', ' ')} and cannot become ${to.replaceAll('_', ' ')}. ${allowed.length ? `It can become: ${allowed.map((s) => s.replaceAll('_', ' ')).join(', ')}.` : 'It cannot change any more.'}`,
  );
}
