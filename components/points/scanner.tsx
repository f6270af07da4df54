"use client";

import { useRouter } from "next/navigation";
import { QrReader } from "@/components/ui/qr-reader";
import { normaliseTagCode, scannedKind, tagCodeFromScan } from "@/lib/domain/service";

/** Finds a lube point by its tag: the phone camera, a photo of the tag, or the code typed in. */
export function TagScanner() {
  const router = useRouter();
  return (
    <QrReader
      idPrefix="tag"
      cameraLabel="Scan with the camera"
      photoLabel="Or scan a photo of the tag"
      typeLabel="Or type the code under the QR"
      typeButton="Open"
      noCodeMessage="No tag code was found in this photo. Hold the phone square to the tag, in good light, and try again."
      onText={(text, via) => {
        if (via === "typed") {
          const code = normaliseTagCode(text);
          if (!code) return "A tag code has 8 letters and digits, for example K7QX3MPA.";
          router.push(`/points/${code}`);
          return null;
        }
        if (scannedKind(text) === "container")
          return "That is a grease container label, not a lube-point tag. Scan the tag on the bearing housing.";
        const code = tagCodeFromScan(text);
        if (!code)
          return "This code is not a Greaseledger lube-point tag. Try again, or type the 8-character code printed under it.";
        router.push(`/points/${code}`);
        return null;
      }}
    />
  );
}
