// Geometry is stored in metres; feet are a display choice. International foot (1959): 1 ft = 0.3048 m exactly.
export const METRES_PER_FOOT = 0.3048
export const SQUARE_METRES_PER_SQUARE_FOOT = METRES_PER_FOOT * METRES_PER_FOOT

export type Units = 'ft' | 'm'

export function toDisplayLength(metres: number, units: Units): number {
  return units === 'ft' ? metres / METRES_PER_FOOT : metres
}

export function fromDisplayLength(value: number, units: Units): number {
  return units === 'ft' ? value * METRES_PER_FOOT : value
}

export function toDisplayArea(squareMetres: number, units: Units): number {
  return units === 'ft' ? squareMetres / SQUARE_METRES_PER_SQUARE_FOOT : squareMetres
}

export function formatLength(metres: number, units: Units, digits = 1): string {
  return `${toDisplayLength(metres, units).toFixed(digits)} ${units === 'ft' ? 'ft' : 'm'}`
}

export function formatArea(squareMetres: number, units: Units, digits = 0): string {
  return `${toDisplayArea(squareMetres, units).toFixed(digits)} ${units === 'ft' ? 'sq ft' : 'm²'}`
}
