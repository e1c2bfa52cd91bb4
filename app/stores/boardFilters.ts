import { defineStore } from 'pinia'

// Board filters persist across pages for the session of the tab.
export const useBoardFilters = defineStore('boardFilters', () => {
  const code = ref('')
  const owner = ref('')
  const set = ref('')
  const query = computed(() => ({
    ...(code.value ? { code: code.value } : {}),
    ...(owner.value ? { owner: owner.value } : {}),
    ...(set.value ? { set: set.value } : {}),
  }))
  function clear() {
    code.value = ''
    owner.value = ''
    set.value = ''
  }
  return { code, owner, set, query, clear }
})
