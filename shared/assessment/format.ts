/**
 * How the assessment writes its numbers, so that every screen and the PDF print a figure the same way: speeds to
 * 0.01 m/s, frequencies to 0.0001 Hz, reduced velocities to 0.01.
 */
export const speedText = (mps: number): string => `${mps.toFixed(2)} m/s`;
export const frequencyText = (hz: number): string => `${hz.toFixed(4)} Hz`;
/** A reduced velocity to 0.01, a table's own end values as written ("2", "16"). */
export const urText = (ur: number): string => String(Number(ur.toFixed(2)));
