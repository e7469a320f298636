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
} as const

export function label<K extends keyof typeof LABELS>(kind: K, value: string | null | undefined): string {
  if (!value) return '—'
  return (LABELS[kind] as Record<string, string>)[value] ?? value
}
