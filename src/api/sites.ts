import { siteListSchema, type Site } from '@shared/schemas/sites'
import { http } from './http'

export type { Site }

export async function fetchSites(signal?: AbortSignal): Promise<Site[]> {
  return (await http.get('/api/sites', { schema: siteListSchema, signal })).items
}
