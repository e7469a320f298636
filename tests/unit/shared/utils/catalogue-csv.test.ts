// Reading the coordinator's CSV: cell parsers and row-level errors (row, column, message).
import { describe, it, expect } from 'vitest'
import { parseCell, parseLength, readCatalogueCsv, catalogueToCsv } from '#shared/utils/catalogue-csv'

describe('cells', () => {
  it('reads lengths in metres or feet', () => {
    expect(parseLength('0.6', 60)).toEqual({ value: 0.6 })
    // 2 ft × 0.3048 m/ft (exact definition) = 0.61 m to the centimetre
    expect(parseLength('2 ft', 60)).toEqual({ value: 0.61 })
    expect(parseLength("3'", 60)).toEqual({ value: 0.91 })
    expect(parseLength('-1', 60)).toHaveProperty('error')
    expect(parseLength('100', 60)).toHaveProperty('error')
  })
  it('reads lists, months, zones, yes/no', () => {
    expect(parseCell('sun', 'part; Full')).toEqual({ value: ['full', 'part'] })
    expect(parseCell('sun', 'dappled')).toHaveProperty('error')
    expect(parseCell('bloomMonths', 'May;6;jul')).toEqual({ value: [5, 6, 7] })
    expect(parseCell('bloomMonths', '13')).toHaveProperty('error')
    expect(parseCell('minZone', '5a')).toEqual({ value: '5a' })
    expect(parseCell('minZone', '15a')).toHaveProperty('error')
    expect(parseCell('scarify', 'Yes')).toEqual({ value: true })
    expect(parseCell('coldMoistDays', '400')).toHaveProperty('error')
    expect(parseCell('status', 'native')).toEqual({ value: 'native' })
  })
})

describe('files', () => {
  it('reports every bad row with its row number and column', () => {
    const csv = 'scientificName,region,status,spread,colour\nZizia aurea,US-OH,native,1\nbad name,,,\nZizia aurea,US-XX,native,\nZizia aurea,,native,\nZizia aurea,US-OH,introduced,\n'
    const { entries, errors } = readCatalogueCsv(csv)
    const at = errors.map((e) => `${e.row}:${e.column}`)
    expect(at).toEqual(expect.arrayContaining(['1:colour', '3:scientificName', '4:region', '5:status', '6:scientificName']))
    expect(entries.map((e) => e.row)).toEqual([2])
    expect(entries[0]!.values).toEqual({ status: 'native', spread: 1 })
  })
  it('needs a header naming scientificName', () => {
    expect(readCatalogueCsv('name\nx\n').errors[0]).toMatchObject({ row: 1, column: 'scientificName' })
  })
  it('writes CSV that reads back, with formulas defused', () => {
    const text = catalogueToCsv(['scientificName', 'sun', 'notes'], [{ scientificName: 'Zizia aurea', sun: ['full', 'part'], notes: '=HYPERLINK("x")' }])
    expect(text.split('\r\n')[1]).toBe(`Zizia aurea,full;part,"'=HYPERLINK(""x"")"`)
    const back = readCatalogueCsv(text)
    expect(back.entries[0]!.values.sun).toEqual(['full', 'part'])
  })
})
