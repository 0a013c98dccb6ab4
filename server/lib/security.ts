// Security headers: helmet with a Content-Security-Policy that allows exactly what the built client
// loads: its own scripts, styles and fonts (IBM Plex and KaTeX's fonts are bundled), nothing remote.
import helmet from "helmet";

function contentSecurityPolicy(production: boolean): Record<string, string[] | null> {
  return {
    "default-src": ["'self'"],
    "base-uri": ["'self'"],
    "connect-src": ["'self'"],
    "font-src": ["'self'"],
    "form-action": ["'self'"],
    "frame-ancestors": ["'none'"],
    // The favicon and the client's own images; exports are downloads (blob: links), which CSP does not govern.
    "img-src": ["'self'"],
    "manifest-src": ["'self'"],
    "object-src": ["'none'"],
    "script-src": ["'self'"],
    "script-src-attr": ["'none'"],
    // Style sheets only from our own files; style attributes are allowed because KaTeX sets
    // heights and offsets through them (style-src is the fallback for browsers without -elem/-attr).
    "style-src": ["'self'", "'unsafe-inline'"],
    "style-src-elem": ["'self'"],
    "style-src-attr": ["'unsafe-inline'"],
    "worker-src": ["'self'"],
    // Only where the deployment speaks HTTPS; plain http on loopback keeps working in development.
    "upgrade-insecure-requests": production ? [] : null,
  };
}

export function securityHeaders(production: boolean) {
  return helmet({
    contentSecurityPolicy: { useDefaults: false, directives: contentSecurityPolicy(production) },
    strictTransportSecurity: production,
    // Nobody frames Portfold (frame-ancestors 'none'); the old header says the same to old browsers.
    frameguard: { action: "deny" },
  });
}
