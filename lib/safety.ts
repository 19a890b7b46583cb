/** The caution on every results screen, report, API document and command-line output. */
export const SAFETY_CAUTION =
  "Sagline is a screening and review aid. Results depend on the inputs given; the engineer of record and the governing local codes decide. Check against licensed practice before anything is fabricated or built.";
