import type { RequestHandler } from 'express';
import helmet from 'helmet';

/** Stripe's hosted checkout: the only outside origin the browser may be sent to (a form post or redirect). */
export const STRIPE_CHECKOUT_ORIGIN = 'https://checkout.stripe.com';

/**
 * helmet with a Content Security Policy that allows only our own origin (OWASP ASVS 4.0.3 14.4.3). Outside
 * production the local Stripe stand-in runs on another local port, so form actions may also go to loopback.
 */
export function securityHeaders(production = process.env.NODE_ENV === 'production'): RequestHandler {
  const localCheckout = production ? [] : ['http://localhost:*', 'http://127.0.0.1:*'];
  return helmet({
    contentSecurityPolicy: {
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'"],
        imgSrc: ["'self'", 'data:', 'blob:'],
        styleSrc: ["'self'", "'unsafe-inline'"],
        fontSrc: ["'self'", 'data:'],
        connectSrc: ["'self'"],
        objectSrc: ["'none'"],
        // Evidence PDFs are read in the page from a blob of their checked bytes; no other frame is allowed.
        frameSrc: ['blob:'],
        baseUri: ["'self'"],
        formAction: ["'self'", STRIPE_CHECKOUT_ORIGIN, ...localCheckout],
        frameAncestors: ["'none'"],
        upgradeInsecureRequests: production ? [] : null,
      },
    },
    strictTransportSecurity: production ? { maxAge: 180 * 24 * 60 * 60, includeSubDomains: true } : false,
    referrerPolicy: { policy: 'same-origin' },
  });
}

/** Answers of the API are never kept by a browser or a proxy: they carry people's data (OWASP ASVS 4.0.3 8.2.1). */
export const noStore: RequestHandler = (_req, res, next) => {
  res.setHeader('Cache-Control', 'no-store');
  next();
};
