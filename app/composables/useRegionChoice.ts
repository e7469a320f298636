// The region (and zone) a visitor last chose on the species pages, kept for the session in a cookie.
export function useRegionChoice() {
  const region = useCookie<string>('ww-region', { default: () => 'US-OH', sameSite: 'lax' })
  const zone = useCookie<string>('ww-zone', { default: () => '', sameSite: 'lax' })
  return { region, zone }
}
