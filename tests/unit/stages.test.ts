import { describe, expect, it } from 'vitest';
import { assertItemAction, ITEM_ACTIONS, ITEM_STAGES, ITEM_TRANSITIONS, type ItemStage } from '#shared/orders/stages.ts';

/**
 * The item state machine and the actions people take on it agree: every action is a legal move
 * from each of its starting stages, every move between working stages has an action, and no two
 * actions to the same stage start from the same place. (The stages are the studio's own workflow:
 * common practice, no source.)
 */
describe('item stages and actions', () => {
  const actions = Object.entries(ITEM_ACTIONS);

  it('makes every action a legal move of the machine', () => {
    for (const [name, { from, to }] of actions)
      for (const stage of from) expect(ITEM_TRANSITIONS[stage as ItemStage], `${name} from ${stage}`).toContain(to);
  });

  it('has an action for every move except payment and cancellation, which the order drives', () => {
    const byOrder = (from: ItemStage, to: ItemStage) => to === 'cancelled' || (from === 'unpaid' && to === 'photo_review');
    for (const from of ITEM_STAGES) {
      for (const to of ITEM_TRANSITIONS[from]) {
        if (byOrder(from, to)) continue;
        expect(
          actions.filter(([, a]) => a.to === to && (a.from as readonly string[]).includes(from)).map(([n]) => n),
          `${from} → ${to}`,
        ).toHaveLength(1);
      }
    }
  });

  it('refuses an action from any other stage with 409, naming where it can be done', () => {
    expect(() => assertItemAction('approvePhoto', 'photo_review')).not.toThrow();
    // A legal move of the machine, but not this action's: approving a photo does not reopen prep.
    expect(() => assertItemAction('approvePhoto', 'approved')).toThrow(
      'This item is approved: that can be done only while it is photo review.',
    );
    // An illegal move: the machine's own message with the moves that are allowed.
    expect(() => assertItemAction('markBurned', 'prep')).toThrow(
      'This item is prep and cannot become burned. It can become: proof sent, approved, cancelled.',
    );
    expect(() => assertItemAction('ship', 'shipped')).toThrow('It cannot change any more.');
  });
});
