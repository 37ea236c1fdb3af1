/**
 * T-DAB Band III block centre frequencies, MHz. A table, not a formula: the spacing is not
 * uniform (5A->5B 1.712 MHz, 5D->6A 1.872 MHz). Values as in docs/checks.md, "Channels and frequencies",
 * tagged there [S]: three secondary sources agree; plans CEPT WI95revCO07 (Constanta 2007)
 * and GE06. The clause of ETSI EN 300 401 holding the table was not read.
 */
export const DAB_BLOCKS: Readonly<Record<string, number>> = Object.freeze({
  '5A': 174.928, '5B': 176.64, '5C': 178.352, '5D': 180.064,
  '6A': 181.936, '6B': 183.648, '6C': 185.36, '6D': 187.072,
  '7A': 188.928, '7B': 190.64, '7C': 192.352, '7D': 194.064,
  '8A': 195.936, '8B': 197.648, '8C': 199.36, '8D': 201.072,
  '9A': 202.928, '9B': 204.64, '9C': 206.352, '9D': 208.064,
  '10A': 209.936, '10B': 211.648, '10C': 213.36, '10D': 215.072, '10N': 210.096,
  '11A': 216.928, '11B': 218.64, '11C': 220.352, '11D': 222.064, '11N': 217.088,
  '12A': 223.936, '12B': 225.648, '12C': 227.36, '12D': 229.072, '12N': 224.096,
  '13A': 230.784, '13B': 232.496, '13C': 234.208, '13D': 235.776, '13E': 237.488, '13F': 239.2,
});

/** Occupied bandwidth of a T-DAB block, MHz (docs/checks.md, "Channels and frequencies"). */
export const DAB_BLOCK_WIDTH_MHZ = 1.536;
