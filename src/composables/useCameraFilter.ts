// Search text + "needs a check" filter over a camera list, grouped by site.
import { computed, onScopeDispose, ref, type Ref } from 'vue'
import type { Camera } from '@shared/schemas/cameras'
import { needsCheck } from '@/utils/cameraDue'
import { groupCamerasBySite } from '@/utils/cameraGroups'

const MINUTE_MS = 60_000

export function useCameraFilter(cameras: Ref<Camera[]>, startWithNeedingCheck: boolean) {
  const query = ref('')
  const onlyNeedingCheck = ref(startWithNeedingCheck)
  // A screen left open through midnight still counts overdue days correctly.
  const now = ref(new Date())
  const timer = setInterval(() => (now.value = new Date()), MINUTE_MS)
  onScopeDispose(() => clearInterval(timer))

  const active = computed(() => cameras.value.filter((c) => c.active))
  const needingCount = computed(() => active.value.filter((c) => needsCheck(c, now.value)).length)
  const totalCount = computed(() => active.value.length)
  const groups = computed(() =>
    groupCamerasBySite(cameras.value, {
      query: query.value,
      onlyNeedingCheck: onlyNeedingCheck.value,
      now: now.value,
    }),
  )
  const shownCount = computed(() => groups.value.reduce((n, g) => n + g.cameras.length, 0))
  return { query, onlyNeedingCheck, now, groups, needingCount, totalCount, shownCount }
}
