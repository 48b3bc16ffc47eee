export interface Me { id: number, email: string, name: string, role: 'admin' | 'member' }

/** The signed-in user (or null), shared across pages; cookies are forwarded during SSR. */
export function useMe() {
  const me = useState<Me | null>('me', () => null)
  const loaded = useState<boolean>('me-loaded', () => false)
  async function refresh() {
    try {
      me.value = await useRequestFetch()<Me>('/api/auth/me')
    }
    catch {
      me.value = null
    }
    loaded.value = true
    return me.value
  }
  async function ensure() {
    if (!loaded.value) await refresh()
    return me.value
  }
  return { me, refresh, ensure }
}
