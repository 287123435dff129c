/**
 * The crate label's QR text, shared with the client through the contracts: labels make it with
 * `crateQrText`, check-in reads it with `parseCrateQr`.
 */
export { crateQrText, parseCrateQr } from '../../../src/domain/contracts/tour.ts';
