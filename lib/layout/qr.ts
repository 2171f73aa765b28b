import QRCode from "qrcode";

/**
 * A QR code as an SVG string, for stake labels: vector, so it prints sharp at any size.
 * Error correction M (about 15 % of the code may be damaged) suits labels that get dirty
 * in the field without making the code much denser. The default 4-module quiet zone is the
 * margin the QR standard asks for, so scanners find the code on a busy label.
 */
export async function qrSvg(text: string): Promise<string> {
  return QRCode.toString(text, { type: "svg", errorCorrectionLevel: "M" });
}
