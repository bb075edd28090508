// The invented demo fleet: three sites, five camera models, forty cameras.

export const DEMO_SITES = [
  {
    key: 'depot',
    name: 'Millbrook Tram Depot',
    address: '14 Depot Lane, Millbrook',
    timeZone: 'Europe/London',
  },
  {
    key: 'yard',
    name: 'Fenwick Freight Yard',
    address: 'Gate 3, Canal Road, Fenwick',
    timeZone: 'Europe/Amsterdam',
  },
  {
    key: 'bottling',
    name: 'Ashcombe Bottling Hall 2',
    address: 'Unit 7, Ashcombe Business Park',
    timeZone: 'Europe/London',
  },
] as const
export type SiteKey = (typeof DEMO_SITES)[number]['key']

export const DEMO_MODELS = [
  // key, name, sensor px, pixel pitch µm, focal range mm, f-number; typical MTF50 when sharp (c/p)
  {
    key: 'dome',
    name: 'Corvid D2 dome',
    sensorWidthPx: 1920,
    sensorHeightPx: 1080,
    pixelPitchUm: 2.9,
    focalLengthMinMm: 2.8,
    focalLengthMaxMm: 12,
    fNumber: 1.6,
    sharpMtf50: 0.31,
  },
  {
    key: 'bullet',
    name: 'Larkspur B4 bullet',
    sensorWidthPx: 2688,
    sensorHeightPx: 1520,
    pixelPitchUm: 2.0,
    focalLengthMinMm: 2.8,
    focalLengthMaxMm: 12,
    fNumber: 1.4,
    sharpMtf50: 0.3,
  },
  {
    key: 'plate',
    name: 'Tern P8 plate camera',
    sensorWidthPx: 1920,
    sensorHeightPx: 1080,
    pixelPitchUm: 2.9,
    focalLengthMinMm: 5,
    focalLengthMaxMm: 50,
    fNumber: 1.6,
    sharpMtf50: 0.33,
  },
  {
    key: 'machine',
    name: 'Osprey M5 machine camera',
    sensorWidthPx: 2448,
    sensorHeightPx: 2048,
    pixelPitchUm: 3.45,
    focalLengthMinMm: 16,
    focalLengthMaxMm: 16,
    fNumber: 2.8,
    sharpMtf50: 0.36,
  },
  {
    key: 'panoramic',
    name: 'Wren F1 panoramic',
    sensorWidthPx: 2560,
    sensorHeightPx: 1920,
    pixelPitchUm: 2.0,
    focalLengthMinMm: 1.4,
    focalLengthMaxMm: 1.4,
    fNumber: 2.0,
    sharpMtf50: 0.27,
  },
] as const
export type ModelKey = (typeof DEMO_MODELS)[number]['key']

/**
 * What the history of a camera looks like:
 * stable — always passes; drifting — sharpness sinks towards its baseline's 0.8 (marginal now);
 * failing — the last check failed, a work order is open; overdue — not checked for too long;
 * repaired — failed months ago, fixed, closed by a passing re-check; ir_shift — soft at night.
 */
export type Profile = 'stable' | 'drifting' | 'failing' | 'overdue' | 'repaired' | 'ir_shift'

export interface DemoCamera {
  assetTag: string
  site: SiteKey
  location: string
  model: ModelKey
  task: string
  focalLengthMm: number
  distanceM: number
  profile: Profile
}

const c = (
  assetTag: string,
  site: SiteKey,
  location: string,
  model: ModelKey,
  task: string,
  focalLengthMm: number,
  distanceM: number,
  profile: Profile = 'stable',
): DemoCamera => ({ assetTag, site, location, model, task, focalLengthMm, distanceM, profile })

export const DEMO_CAMERAS: readonly DemoCamera[] = [
  c('MTD-001', 'depot', 'Main gate, inbound lane', 'plate', 'plate_reading', 25, 20),
  c('MTD-002', 'depot', 'Main gate, outbound lane', 'plate', 'plate_reading', 25, 18, 'drifting'),
  c('MTD-003', 'depot', 'Staff entrance turnstiles', 'dome', 'identify', 8, 7, 'repaired'),
  c('MTD-004', 'depot', 'Control room door', 'dome', 'identify', 8, 6, 'ir_shift'),
  c('MTD-005', 'depot', 'Platform 1, north end', 'bullet', 'observe', 4, 22),
  c('MTD-006', 'depot', 'Platform 1, south end', 'bullet', 'observe', 4, 22, 'failing'),
  c('MTD-007', 'depot', 'Platform 2, north end', 'bullet', 'observe', 4, 20),
  c('MTD-008', 'depot', 'Platform 2, south end', 'bullet', 'observe', 4, 20),
  c('MTD-009', 'depot', 'Wash road', 'bullet', 'recognise', 6, 14),
  c('MTD-010', 'depot', 'Sand filling point', 'bullet', 'recognise', 6, 12),
  c('MTD-011', 'depot', 'Inspection pit 3', 'dome', 'recognise', 6, 10, 'overdue'),
  c('MTD-012', 'depot', 'Workshop overview', 'panoramic', 'monitor', 1.4, 25),
  c('MTD-013', 'depot', 'Stores yard', 'panoramic', 'monitor', 1.4, 20),
  c('MTD-014', 'depot', 'Perimeter fence, east', 'dome', 'detect', 2.8, 25),
  c('MTD-015', 'depot', 'Perimeter fence, west', 'dome', 'detect', 2.8, 25),
  c('MTD-016', 'depot', 'Cash office counter', 'dome', 'identify', 10, 5),
  c('FFY-001', 'yard', 'Gate 3, trucks in', 'plate', 'plate_reading', 35, 25),
  c('FFY-002', 'yard', 'Gate 3, trucks out', 'plate', 'plate_reading', 35, 25, 'failing'),
  c('FFY-003', 'yard', 'Weighbridge', 'plate', 'plate_reading', 25, 15),
  c('FFY-004', 'yard', 'Dock door 1', 'bullet', 'recognise', 6, 12),
  c('FFY-005', 'yard', 'Dock door 2', 'bullet', 'recognise', 6, 12, 'drifting'),
  c('FFY-006', 'yard', 'Dock door 3', 'bullet', 'recognise', 6, 12),
  c('FFY-007', 'yard', 'Dock door 4', 'bullet', 'recognise', 6, 12, 'overdue'),
  c('FFY-008', 'yard', 'Container stack A', 'bullet', 'observe', 4, 25),
  c('FFY-009', 'yard', 'Container stack B', 'bullet', 'observe', 4, 25),
  c('FFY-010', 'yard', 'Reefer plug-in row', 'bullet', 'observe', 4, 18),
  c('FFY-011', 'yard', 'Driver reception desk', 'dome', 'identify', 8, 6),
  c('FFY-012', 'yard', 'Office entrance', 'dome', 'identify', 8, 7, 'drifting'),
  c('FFY-013', 'yard', 'Rail siding', 'panoramic', 'monitor', 1.4, 30),
  c('FFY-014', 'yard', 'North fence line', 'dome', 'detect', 2.8, 28, 'overdue'),
  c('ABH-001', 'bottling', 'Filler outfeed, fill level', 'machine', 'process_inspection', 16, 1.2),
  c(
    'ABH-002',
    'bottling',
    'Capper, cap presence',
    'machine',
    'process_inspection',
    16,
    1.0,
    'failing',
  ),
  c('ABH-003', 'bottling', 'Labeller, label position', 'machine', 'process_inspection', 16, 1.4),
  c(
    'ABH-004',
    'bottling',
    'Date coder, print check',
    'machine',
    'process_inspection',
    16,
    0.8,
    'drifting',
  ),
  c('ABH-005', 'bottling', 'Case packer infeed', 'machine', 'process_inspection', 16, 1.6),
  c('ABH-006', 'bottling', 'QA bench, sample table', 'machine', 'inspect', 16, 2.5),
  c('ABH-007', 'bottling', 'Glass inspection booth', 'machine', 'inspect', 16, 3),
  c('ABH-008', 'bottling', 'Hall 2 overview', 'bullet', 'observe', 4, 24),
  c('ABH-009', 'bottling', 'Loading bay', 'bullet', 'observe', 4, 20),
  c('ABH-010', 'bottling', 'Staff entrance', 'dome', 'identify', 8, 7),
]
