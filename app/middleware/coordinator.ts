// Pages for the organisation's coordinators (the server checks again on every route).
export default defineNuxtRouteMiddleware((to) => {
  const { loggedIn, user } = useUserSession()
  if (!loggedIn.value) return navigateTo({ path: '/login', query: { next: to.fullPath } })
  if (user.value?.role !== 'coordinator') return abortNavigation(createError({ statusCode: 403, statusMessage: 'Coordinators only' }))
})
