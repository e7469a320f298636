// A small yard both the pure edits' tests and the editor store's tests work on.
import { emptyYardDocument, type YardDocument } from '#shared/schemas/yard-document'

export function sampleDoc(): YardDocument {
  return emptyYardDocument({
    boundary: [[0, 0], [20, 0], [20, 10], [0, 10]],
    areas: [
      { id: 'house', kind: 'building', z: 3, points: [[1, 1], [5, 1], [5, 4], [1, 4]] },
      { id: 'bed', kind: 'bed', z: 2, points: [[8, 2], [12, 2], [12, 6], [8, 6]] },
    ],
    plantings: [
      { id: 'lawn', species: 'Poa pratensis', z: 1, points: [[0, 0], [20, 0], [20, 10], [0, 10]], spacing: null },
      { id: 'oak', species: 'Quercus alba', x: 15, y: 5, count: 1, spread: 6 },
      { id: 'aster', species: 'Symphyotrichum novae-angliae', x: 10, y: 4, count: 4, spread: 0.5 },
    ],
    lines: [{ id: 'wire', kind: 'overhead', points: [[0, 9], [20, 9]] }],
  })
}
