// Before each component test file. happy-dom's document has no compatMode, which KaTeX reads as
// quirks mode and warns about on every render; the app's pages are in standards mode.
if (!document.compatMode) Object.defineProperty(document, 'compatMode', { value: 'CSS1Compat', configurable: true })
