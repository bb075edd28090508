import { beforeEach, describe, expect, it } from 'vitest'
import { createPinia, setActivePinia, type Pinia } from 'pinia'
import type { CameraModel, Site, Task, User } from '@/api/setup'
import { renderHtml, textOf } from '@/components/common/__tests__/renderHtml'
import { useSetupStore } from '@/stores/setup'
import CamerasPanel from '../CamerasPanel.vue'
import ModelsPanel from '../ModelsPanel.vue'
import SitesPanel from '../SitesPanel.vue'
import TasksPanel from '../TasksPanel.vue'
import UsersPanel from '../UsersPanel.vue'

const AT = '2031-06-09T10:00:00.000Z'
let pinia: Pinia
beforeEach(() => {
  pinia = createPinia()
  setActivePinia(pinia)
})
const show = async (panel: unknown) => textOf(await renderHtml(panel, {}, { plugins: [pinia] }))

const user = (id: number, name: string, role: User['role'], active: boolean): User => ({
  id,
  name,
  email: `${name.toLowerCase().replace(' ', '.')}@sharpfield.test`,
  role,
  active,
  createdAt: AT,
  updatedAt: AT,
})
const model = (id: number, name: string, minMm: number, maxMm: number): CameraModel => ({
  id,
  name,
  sensorWidthPx: 2560,
  sensorHeightPx: 1440,
  pixelPitchUm: 2.9,
  focalLengthMinMm: minMm,
  focalLengthMaxMm: maxMm,
  fNumber: 1.6,
  updatedAt: AT,
})

describe('the setup panels', () => {
  it('list people with their role, and say when an account is switched off', async () => {
    useSetupStore().users = [
      user(1, 'Rhea Lindqvist', 'admin', true),
      user(2, 'Jonas Okafor', 'maintenance', false),
    ]
    expect(await show(UsersPanel)).toBe(
      '2 users New user Rhea Lindqvist rhea.lindqvist@sharpfield.test Administrator ' +
        'Jonas Okafor jonas.okafor@sharpfield.test Maintenance · switched off',
    )
  })

  it('list sites with their camera count, address and time zone', async () => {
    const site: Site = {
      id: 3,
      name: 'Millbrook Tram Depot',
      address: '4 Foundry Lane',
      timeZone: 'Europe/London',
      cameraCount: 12,
      updatedAt: AT,
    }
    useSetupStore().sites = [
      site,
      { ...site, id: 4, name: 'Quay Yard', address: '', cameraCount: 0 },
    ]
    expect(await show(SitesPanel)).toBe(
      '2 sites New site Millbrook Tram Depot (12) 4 Foundry Lane · Europe/London ' +
        'Quay Yard (0) Europe/London',
    )
  })

  it('list camera models with one focal length for a fixed lens and a range for a zoom', async () => {
    useSetupStore().models = [
      model(1, 'Corvid D2 dome', 4, 4),
      model(2, 'Corvid Z8 bullet', 2.8, 12),
    ]
    expect(await show(ModelsPanel)).toBe(
      '2 camera models New model ' +
        'Corvid D2 dome 2560 × 1440 px · 2.9 µm · 4 mm · f/1.6 ' +
        'Corvid Z8 bullet 2560 × 1440 px · 2.9 µm · 2.8–12 mm · f/1.6',
    )
  })

  it('list tasks with their thresholds under the note, with no way to add one', async () => {
    const task: Task = {
      id: 'recognise',
      name: 'Recognise',
      description: '',
      requiredPxPerM: 125,
      minMtf50CyPx: 0.2,
      marginalBand: 0.1,
      driftWarnRatio: 0.85,
      driftFailRatio: 0.7,
      nightDayWarnRatio: 0.6,
      checkIntervalDays: 180,
      workOrderPriority: 'normal',
      workOrderDueDays: 14,
      version: 1,
      updatedAt: AT,
    }
    useSetupStore().tasks = [task]
    expect(await show(TasksPanel)).toBe(
      'Defaults for every camera with the task; a camera may override the minimum MTF50, ' +
        'pixel density and interval. ' +
        'Recognise MTF50 ≥ 0.2 c/px · 125 px/m · every 180 days · drift 0.85/0.7',
    )
  })

  it('offer a new camera and a search before the camera list has arrived', async () => {
    const html = await renderHtml(CamerasPanel, {}, { plugins: [pinia] })
    expect(textOf(html)).toBe('New camera')
    expect(html).toContain('placeholder="Asset tag or location"')
    expect(html).not.toContain('setup-camera-row')
  })
})
