// Every state a person sees, in plain words: one table per kind of thing, read by pages, e-mails and CSV.

export const ORDER_STATUSES = ['cart', 'awaiting_payment', 'paid', 'packed', 'picked_up', 'sent', 'cancelled', 'refunded'] as const
export type OrderStatus = (typeof ORDER_STATUSES)[number]

export const DONATION_STATUSES = ['awaiting_payment', 'paid', 'cancelled', 'refunded'] as const
export type DonationStatus = (typeof DONATION_STATUSES)[number]

export const DELIVERY_KINDS = ['pickup', 'mail'] as const
export type DeliveryKind = (typeof DELIVERY_KINDS)[number]

export const PAYMENT_KINDS = ['card', 'at_pickup'] as const
export type PaymentKind = (typeof PAYMENT_KINDS)[number]

export const LABELS = {
  orderStatus: {
    cart: 'In the cart',
    awaiting_payment: 'Waiting for payment',
    paid: 'Paid',
    packed: 'Packed',
    picked_up: 'Picked up',
    sent: 'Sent by mail',
    cancelled: 'Cancelled',
    refunded: 'Refunded',
  } satisfies Record<OrderStatus, string>,
  donationStatus: {
    awaiting_payment: 'Waiting for payment',
    paid: 'Received',
    cancelled: 'Not completed',
    refunded: 'Refunded',
  } satisfies Record<DonationStatus, string>,
  delivery: { pickup: 'Pick up', mail: 'By mail' } satisfies Record<DeliveryKind, string>,
  payment: { card: 'Card', at_pickup: 'Pay at pickup' } satisfies Record<PaymentKind, string>,
  layer: { tree: 'Tree', shrub: 'Shrub', ground: 'Ground layer' },
  /** an area's or planting's phase in the plan */
  phase: { existing: 'There now', planned: 'To plant', removing: 'To remove' },
  /** the editor's switch: the yard now, with the plan, or both */
  phaseView: { now: 'Now', planned: 'With the plan', both: 'Both' },
  /** the words beside a share: "16 % now → 74 % with the plan" */
  shareView: { now: 'now', planned: 'with the plan' },
  workAction: { planted: 'Planted', removed: 'Removed' },
} as const

export const PHASE_LABELS = LABELS.phase
export const PHASE_VIEW_LABELS = LABELS.phaseView
export const SHARE_VIEW_LABELS = LABELS.shareView

/** "16.0 % now → 74.0 % with the plan" (a share of null shows as a dash). */
export function nowAndPlan(now: number | null | undefined, planned: number | null | undefined, digits = 1): string {
  const pct = (s: number | null | undefined) => (s === null || s === undefined ? '—' : `${(s * 100).toFixed(digits)} %`)
  return `${pct(now)} ${SHARE_VIEW_LABELS.now} → ${pct(planned)} ${SHARE_VIEW_LABELS.planned}`
}

export function label<K extends keyof typeof LABELS>(kind: K, value: string | null | undefined): string {
  if (!value) return '—'
  return (LABELS[kind] as Record<string, string>)[value] ?? value
}
