// Types the sale's pages share (the server's answers) and one money formatter bound to a currency.
import { formatMoney } from '#shared/utils/money'

export interface LotView {
  id: number; scientificName: string; commonName: string | null; collected: string; contents: string; priceMinor: number; currency: string
  stock: number; growingNotes: string | null; treatment: string; sowingSteps: string[]; layer: string | null; bloom: string; heightM: number | null
  seedsPerPacket: number | null; packetMilligrams: number | null
}
export interface Pickup { id: number; saleId: number; startsAt: string; place: string }
export interface OrderLine { lotId: number; quantity: number; unitPriceMinor: number; lot: LotView }
export interface Cart {
  id: number; status: string; currency: string; subtotalMinor: number; deliveryFeeMinor: number; totalMinor: number; lines: OrderLine[]
  delivery: string | null; payment: string | null; pickup: Pickup | null; mailingAddress: string | null; placedAt: string | null; paidAt: string | null
  buyer: { name: string; email: string } | null; sale: { id: number; name: string }
}

export function useMoney(currency: () => string | undefined) {
  return (minor: number) => formatMoney(minor, currency() ?? 'usd')
}
