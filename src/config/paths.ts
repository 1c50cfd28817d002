/** Every client route in one place, so links and the router agree. */
export const paths = {
  signIn: { path: '/sign-in', href: (next?: string) => (next ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in') },
  home: { path: '/', href: () => '/' },
  about: { path: '/about', href: () => '/about' },
  changePassword: { path: '/account/password', href: () => '/account/password' },
  adminUsers: { path: '/admin/users', href: () => '/admin/users' },
} as const;
