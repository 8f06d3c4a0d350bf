import helmet from 'helmet';

/**
 * Security headers. The PWA needs: its own scripts and service worker, inline style attributes
 * (React's style prop is applied by script, which CSP allows; Tailwind ships a stylesheet),
 * data:/blob: images for QR codes and target photos, and fetches to its own origin only.
 */
export const securityHeaders = helmet({
  contentSecurityPolicy: {
    useDefaults: false,
    directives: {
      defaultSrc: ["'self'"],
      scriptSrc: ["'self'"],
      styleSrc: ["'self'"],
      imgSrc: ["'self'", 'data:', 'blob:'],
      fontSrc: ["'self'"],
      connectSrc: ["'self'"],
      workerSrc: ["'self'"],
      manifestSrc: ["'self'"],
      objectSrc: ["'none'"],
      baseUri: ["'self'"],
      formAction: ["'self'"],
      frameAncestors: ["'none'"],
    },
  },
  // Clubs often run the server on a laptop over plain http on the field network; do not force https.
  strictTransportSecurity: false,
  crossOriginEmbedderPolicy: false,
});
