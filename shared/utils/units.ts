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

/**
 * An area rounded UP in the yard's units to three significant figures (so it exceeds the exact figure by under
 * 1 %): the amount a move asks for, in square metres, and its words. A move's amount must still be enough once rounded.
 */
export function areaAtLeast(squareMetres: number, units: Units): { squareMetres: number; text: string } {
  const v = toDisplayArea(squareMetres, units)
  if (!(v > 0)) return { squareMetres: 0, text: formatArea(0, units) }
  const step = 10 ** (Math.floor(Math.log10(v)) - 2)
  const up = Number((Math.ceil(v / step - 1e-9) * step).toPrecision(3))
  const shown = up.toLocaleString('en-US', { maximumSignificantDigits: 3 })
  return { squareMetres: units === 'ft' ? up * SQUARE_METRES_PER_SQUARE_FOOT : up, text: `${shown} ${units === 'ft' ? 'sq ft' : 'm²'}` }
}
