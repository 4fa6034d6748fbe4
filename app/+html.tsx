import { ScrollViewStyleReset } from 'expo-router/html';
import type { PropsWithChildren } from 'react';
import { EARLY_REQUESTS_GLOBAL, START_QUEUE_GLOBAL } from '@/features/api/client';
import { BREAKPOINTS } from '@/features/ui/breakpoints.shared';
import { colors, space } from '@/features/ui/theme';

// The HTML frame of every pre-rendered page (web only; runs in Node at build time, never in the browser).
// Beside Expo's defaults: the paper colour from the first byte (no white flash), and bold system faces
// for the bold family's fallback, so headings and buttons stay bold on a first visit where the font
// files came too late to be used (font-display: optional, see features/ui/use-app-fonts.web.ts); and the
// width rules of the shell frame shown before the session is known (ShellFrame in features/shell).
const FALLBACK_FACES = `
@font-face{font-family:"Squadline Bold Fallback";font-weight:400;src:local("Arial Bold"),local("Arial-BoldMT"),local("Helvetica Bold"),local("Helvetica-Bold"),local("Roboto Bold"),local("Roboto-Bold"),local("Segoe UI Bold"),local("SegoeUI-Bold"),local("Liberation Sans Bold"),local("LiberationSans-Bold"),local("DejaVu Sans Bold"),local("DejaVuSans-Bold")}
html,body{background-color:${colors.paper}}
[data-frame="wide"]{display:none!important}
@media (min-width:${BREAKPOINTS.wide}px){[data-frame="phone"]{display:none!important}[data-frame="wide"]{display:flex!important}}
@media (min-width:${BREAKPOINTS.tablet}px){[data-frame-content]{padding:${space.xxl}px!important}}`;

// Every screen starts by asking who is signed in (`/api/me`, features/auth/api/get-me.ts). Asked from the
// page, the answer travels while the JavaScript downloads instead of after it has run; the app takes it
// once (`apiStartedEarly`). The capture screen (`/screening/assessments/:id`) also asks for its
// assessment (its head and step come from it), and a round (`/screening/rounds/:id`) for the round with
// its athletes (the whole screen is drawn from it). Queued for the start of the page's scripts, after its first
// paint (server/dev/route-chunks.mjs), so that the first paint never waits for the answer. Plain ES5 so
// it runs in any browser; a failure leaves the app to ask again, and a signed-out answer to /me drops the
// rest (`forgetEarlyRequests`).
const EARLY_REQUESTS = `(window.${START_QUEUE_GLOBAL}=window.${START_QUEUE_GLOBAL}||[]).push(function(){var o={credentials:"include",headers:{Accept:"application/json"}};function get(p){return fetch("/api"+p,o).catch(function(){return null})}var e=window.${EARLY_REQUESTS_GLOBAL}={"/me":get("/me")};var m=/^\\/screening\\/(assessments|rounds)\\/([0-9a-fA-F-]{36})\\/?$/.exec(location.pathname);if(m)e["/"+m[1]+"/"+m[2]]=get("/"+m[1]+"/"+m[2])});`;

export default function Root({ children }: PropsWithChildren) {
  return (
    <html lang="en">
      <head>
        <meta charSet="utf-8" />
        <meta httpEquiv="X-UA-Compatible" content="IE=edge" />
        <meta name="viewport" content="width=device-width, initial-scale=1, shrink-to-fit=no" />
        <meta name="theme-color" content={colors.pine} />
        <ScrollViewStyleReset />
        <style dangerouslySetInnerHTML={{ __html: FALLBACK_FACES }} />
        <script dangerouslySetInnerHTML={{ __html: EARLY_REQUESTS }} />
      </head>
      <body>{children}</body>
    </html>
  );
}
