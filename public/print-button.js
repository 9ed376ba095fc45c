// Print buttons (`<button data-print>`) on the chair's script and the printable measure pages.
// A file of its own, not an inline script or onclick attribute, so the content security policy
// needs no 'unsafe-inline' for scripts (src/lib/server/csp.ts).
for (const button of document.querySelectorAll("[data-print]")) button.addEventListener("click", () => window.print());
