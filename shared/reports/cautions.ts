/**
 * The cautions every issued report carries (ISO/IEC 17025 §7.8.2.1 and the product's own
 * cautions), worded once for the PDF and any page that shows a report.
 */
export const REPORT_CAUTIONS = [
  'The results relate only to the items examined and tested, as received.',
  'This report shall not be reproduced except in full without the written approval of the laboratory.',
  'Conclusions rest with the applicable codes and standards, the client’s specifications and the judgment of competent, authorised (where required, licensed) professionals.',
] as const
