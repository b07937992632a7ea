// The Content-Security-Policy for pages. Scripts need this request's nonce (Next.js applies it to
// its own scripts); styles allow inline because the grid and chart libraries set style attributes.
// Forms may post to ourselves and to the payment page's origin (a checkout redirect follows a form).
export function paymentOrigins(): string[] {
  const base = process.env.STRIPE_API_BASE;
  if (base) {
    try {
      return [new URL(base).origin];
    } catch {
      return [];
    }
  }
  return ['https://checkout.stripe.com'];
}

export function contentSecurityPolicy(nonce: string, opts: { dev: boolean; https: boolean }): string {
  const directives = [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${opts.dev ? " 'unsafe-eval'" : ''}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' blob: data:",
    "font-src 'self'",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    `form-action 'self' ${paymentOrigins().join(' ')}`.trim(),
    "frame-ancestors 'none'",
    ...(opts.https ? ['upgrade-insecure-requests'] : []),
  ];
  return directives.join('; ');
}
