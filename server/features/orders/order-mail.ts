import { formatMoney } from '#shared/money.ts';
import { escapeHtml } from '#server/lib/html.ts';

type Line = { name: string; quantity: number; price: string };

/** An order's lines as the e-mails list them, from each item's snapshot of what was ordered. */
export const mailLines = (
  items: Array<{ snapshot: { blank: { name: string }; size: { label: string } }; quantity: number; unitPriceMinor: number }>,
  currency: string,
): Line[] =>
  items.map((i) => ({
    name: `${i.snapshot.blank.name}, ${i.snapshot.size.label}`,
    quantity: i.quantity,
    price: formatMoney(i.unitPriceMinor * i.quantity, currency),
  }));

const list = (lines: Line[]) => lines.map((l) => `${l.quantity} × ${l.name}: ${l.price}`).join('\n');
const htmlList = (lines: Line[]) =>
  `<ul>${lines.map((l) => `<li>${l.quantity} × ${escapeHtml(l.name)}: ${escapeHtml(l.price)}</li>`).join('')}</ul>`;

/** To the buyer once payment is in (written at checkout, held until then): what was ordered and the private link to follow it. */
export function orderReceivedMail(input: {
  studioName: string;
  number: number;
  buyerName: string;
  lines: Line[];
  total: string;
  url: string;
  /** How it reaches the buyer: "Tracked post, 3–5 working days" or "Pickup at the studio". */
  delivery: string;
  /** The studio's own address for questions, when it has one. */
  contact: string | null;
}) {
  const ask = input.contact ? `Questions? Write to ${input.contact} (or just answer this e-mail).` : 'Questions? Just answer this e-mail.';
  return {
    subject: `Your order ${input.number} at ${input.studioName}`,
    text: `Hello ${input.buyerName},\n\nThank you: ${input.studioName} has your order ${input.number} and your payment of ${input.total}.\n\n${list(input.lines)}\nDelivery: ${input.delivery}\n\nWe check every photo before engraving and will write if we need anything from you. Follow your order here:\n${input.url}\n\nKeep this link to yourself: it opens your order.\n\n${ask}`,
    html: `<p>Hello ${escapeHtml(input.buyerName)},</p><p>Thank you: ${escapeHtml(input.studioName)} has your order <strong>${input.number}</strong> and your payment of ${escapeHtml(input.total)}.</p>${htmlList(input.lines)}<p>Delivery: ${escapeHtml(input.delivery)}</p><p>We check every photo before engraving and will write if we need anything from you.</p><p><a href="${escapeHtml(input.url)}">Follow your order</a></p><p>Keep this link to yourself: it opens your order.</p><p>${escapeHtml(ask)}</p>`,
  };
}

/** To the studio: a paid order waiting for its photo review. */
export function newOrderMail(input: { studioName: string; number: number; buyerName: string; lines: Line[]; total: string; url: string }) {
  return {
    subject: `New order ${input.number} from ${input.buyerName}`,
    text: `${input.buyerName} has ordered and paid ${input.total} at ${input.studioName}:\n\n${list(input.lines)}\n\nThe photos are waiting for review:\n${input.url}`,
    html: `<p>${escapeHtml(input.buyerName)} has ordered and paid ${escapeHtml(input.total)} at ${escapeHtml(input.studioName)}:</p>${htmlList(input.lines)}<p><a href="${escapeHtml(input.url)}">Open the workspace</a></p>`,
  };
}

/** To the buyer when stock ran out between checkout and payment: refunded, nothing to do. */
export function soldOutMail(input: { studioName: string; number: number; buyerName: string; what: string; total: string }) {
  return {
    subject: `Order ${input.number} at ${input.studioName}: refunded, sold out`,
    text: `Hello ${input.buyerName},\n\nWe are sorry: ${input.what} sold out while you were paying, so ${input.studioName} could not take order ${input.number}. Your payment of ${input.total} has been refunded in full; it shows on your statement within a few days.`,
    html: `<p>Hello ${escapeHtml(input.buyerName)},</p><p>We are sorry: ${escapeHtml(input.what)} sold out while you were paying, so ${escapeHtml(input.studioName)} could not take order ${input.number}. Your payment of ${escapeHtml(input.total)} has been refunded in full; it shows on your statement within a few days.</p>`,
  };
}

/** To the buyer when the studio needs a better photo: why, and the private link to send one. */
export function newPhotoNeededMail(input: {
  studioName: string;
  number: number;
  buyerName: string;
  what: string;
  reason: string;
  note: string;
  url: string;
}) {
  return {
    subject: `Order ${input.number}: ${input.studioName} needs a new photo`,
    text: `Hello ${input.buyerName},\n\nBefore engraving ${input.what}, ${input.studioName} checked your photo and needs another one.\n\nWhy: ${input.reason}.${input.note ? `\nFrom the studio: ${input.note}` : ''}\n\nSend a new photo here (the link works once):\n${input.url}\n\nNothing else about your order changes.`,
    html: `<p>Hello ${escapeHtml(input.buyerName)},</p><p>Before engraving ${escapeHtml(input.what)}, ${escapeHtml(input.studioName)} checked your photo and needs another one.</p><p><strong>Why:</strong> ${escapeHtml(input.reason)}.${input.note ? `<br><strong>From the studio:</strong> ${escapeHtml(input.note)}` : ''}</p><p><a href="${escapeHtml(input.url)}">Send a new photo</a> (the link works once).</p><p>Nothing else about your order changes.</p>`,
  };
}

export function refundedMail(input: { studioName: string; number: number; buyerName: string; amount: string; reason: string }) {
  return {
    subject: `Order ${input.number}: ${input.amount} refunded`,
    text: `Hello ${input.buyerName},\n\n${input.studioName} has refunded ${input.amount} of order ${input.number}.\nReason: ${input.reason}\n\nIt shows on your statement within a few days.`,
    html: `<p>Hello ${escapeHtml(input.buyerName)},</p><p>${escapeHtml(input.studioName)} has refunded ${escapeHtml(input.amount)} of order ${input.number}.<br>Reason: ${escapeHtml(input.reason)}</p><p>It shows on your statement within a few days.</p>`,
  };
}

export function cancelledMail(input: { studioName: string; number: number; buyerName: string; reason: string; refund: string }) {
  return {
    subject: `Order ${input.number} at ${input.studioName} is cancelled`,
    text: `Hello ${input.buyerName},\n\n${input.studioName} has cancelled order ${input.number}.\nReason: ${input.reason}\n${input.refund ? `\n${input.refund} It shows on your statement within a few days.\n` : ''}`,
    html: `<p>Hello ${escapeHtml(input.buyerName)},</p><p>${escapeHtml(input.studioName)} has cancelled order ${input.number}.<br>Reason: ${escapeHtml(input.reason)}</p>${input.refund ? `<p>${escapeHtml(input.refund)} It shows on your statement within a few days.</p>` : ''}`,
  };
}

/** To the buyer: the proof is ready; approve it or say what to change. */
export function proofMail(input: { studioName: string; number: number; buyerName: string; what: string; url: string }) {
  return {
    subject: `Order ${input.number}: your proof from ${input.studioName}`,
    text: `Hello ${input.buyerName},\n\n${input.studioName} has prepared ${input.what} for engraving. See how it will burn, then approve it or tell us what to change:\n${input.url}\n\nNothing is engraved until you approve.`,
    html: `<p>Hello ${escapeHtml(input.buyerName)},</p><p>${escapeHtml(input.studioName)} has prepared ${escapeHtml(input.what)} for engraving.</p><p><a href="${escapeHtml(input.url)}">See the proof, approve it or ask for changes</a></p><p>Nothing is engraved until you approve.</p>`,
  };
}

/** To the buyer when items leave the studio: by carrier with tracking, or handed over in person. */
export function handedOverMail(input: {
  studioName: string;
  number: number;
  buyerName: string;
  what: string[];
  method: 'ship' | 'pickup';
  carrier?: string;
  trackingNumber?: string;
  complete: boolean;
}) {
  const how =
    input.method === 'ship'
      ? `is on its way with ${input.carrier}. Tracking number: ${input.trackingNumber}`
      : 'was collected at the studio';
  const rest = input.complete
    ? 'That completes your order. Thank you for ordering from us!'
    : 'The rest of your order follows; we will write again.';
  return {
    subject: input.method === 'ship' ? `Order ${input.number} has shipped` : `Order ${input.number}: picked up`,
    text: `Hello ${input.buyerName},\n\nYour ${input.what.join(', ')} from ${input.studioName} ${how}.\n\n${rest}\n\nYour order page (the link in your first e-mail) shows this too.`,
    html: `<p>Hello ${escapeHtml(input.buyerName)},</p><p>Your ${escapeHtml(input.what.join(', '))} from ${escapeHtml(input.studioName)} ${escapeHtml(how)}.</p><p>${escapeHtml(rest)}</p><p>Your order page (the link in your first e-mail) shows this too.</p>`,
  };
}

/** To a buyer collecting in person, once every piece of the order is engraved: where and when. */
export function readyToCollectMail(input: { studioName: string; number: number; buyerName: string; pickupNote: string }) {
  const where = input.pickupNote || 'Ask the studio when suits you.';
  return {
    subject: `Order ${input.number} is ready to collect`,
    text: `Hello ${input.buyerName},\n\nYour order ${input.number} from ${input.studioName} is engraved and ready for you to collect.\n\nWhere and when: ${where}\n\nPlease bring your order number.`,
    html: `<p>Hello ${escapeHtml(input.buyerName)},</p><p>Your order <strong>${input.number}</strong> from ${escapeHtml(input.studioName)} is engraved and ready for you to collect.</p><p>Where and when: ${escapeHtml(where)}</p><p>Please bring your order number.</p>`,
  };
}

/** To the buyer when money arrived for an order that had already lapsed: refunded, order again. */
export function latePaymentMail(input: { studioName: string; number: number; buyerName: string; total: string }) {
  return {
    subject: `Order ${input.number} at ${input.studioName}: payment refunded`,
    text: `Hello ${input.buyerName},\n\nYour payment of ${input.total} for order ${input.number} reached ${input.studioName} after the order had lapsed, so it has been refunded in full; it shows on your statement within a few days.\n\nYou are welcome to place the order again.`,
    html: `<p>Hello ${escapeHtml(input.buyerName)},</p><p>Your payment of ${escapeHtml(input.total)} for order ${input.number} reached ${escapeHtml(input.studioName)} after the order had lapsed, so it has been refunded in full; it shows on your statement within a few days.</p><p>You are welcome to place the order again.</p>`,
  };
}
