// Rounds: supervisors assign cameras or sites to inspectors with a due date.
import {
  assigneeListSchema,
  roundDetailSchema,
  roundListSchema,
  type RoundAssignee,
  type RoundCreate,
  type RoundDetail,
  type RoundList,
} from '@shared/schemas/rounds'
import { http, type Query } from './http'

export type { RoundAssignee, RoundCreate, RoundDetail, RoundList }

export const fetchRounds = (query: Query): Promise<RoundList> =>
  http.get('/api/rounds', { query, schema: roundListSchema })
export const fetchRound = (id: number): Promise<RoundDetail> =>
  http.get(`/api/rounds/${id}`, { schema: roundDetailSchema })
export const createRound = (input: RoundCreate): Promise<RoundDetail> =>
  http.post('/api/rounds', input, { schema: roundDetailSchema })
export const cancelRound = (id: number, reason?: string): Promise<RoundDetail> =>
  http.post(`/api/rounds/${id}/cancel`, { reason }, { schema: roundDetailSchema })
export async function fetchAssignees(): Promise<RoundAssignee[]> {
  return (await http.get('/api/round-assignees', { schema: assigneeListSchema })).items
}
