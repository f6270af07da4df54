"use client";

import { useRouter } from "next/navigation";
import { useEffect, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { inputClasses } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { normaliseTagCode, tagCodeFromScan } from "@/lib/domain/service";

type Scanner = { stop(): Promise<void>; clear(): void; isScanning: boolean };

/** Finds a lube point by its tag: the phone camera, a photo of the tag, or the code typed in. */
export function TagScanner() {
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  const [scanning, setScanning] = useState(false);
  const [typed, setTyped] = useState("");
  const scanner = useRef<Scanner | null>(null);

  useEffect(() => () => void scanner.current?.stop().catch(() => {}), []);

  function open(text: string) {
    const code = tagCodeFromScan(text);
    if (!code) {
      setMessage("This code is not a Greaseledger lube-point tag. Try again, or type the 8-character code printed under it.");
      return false;
    }
    router.push(`/points/${code}`);
    return true;
  }

  async function startCamera() {
    setMessage(null);
    try {
      const { Html5Qrcode } = await import("html5-qrcode");
      const instance = new Html5Qrcode("tag-reader");
      scanner.current = instance as unknown as Scanner;
      setScanning(true);
      await instance.start(
        { facingMode: "environment" },
        { fps: 10, qrbox: { width: 240, height: 240 } },
        (text) => {
          if (open(text)) void instance.stop().catch(() => {});
        },
        () => {},
      );
    } catch {
      setScanning(false);
      setMessage("The camera could not be started (no camera, or permission refused). Scan a photo of the tag or type its code.");
    }
  }

  async function scanPhoto(event: React.ChangeEvent<HTMLInputElement>) {
    const file = event.target.files?.[0];
    if (!file) return;
    setMessage(null);
    try {
      const { Html5Qrcode } = await import("html5-qrcode");
      const instance = new Html5Qrcode("tag-reader-file");
      const text = await instance.scanFile(file, false);
      instance.clear();
      open(text);
    } catch {
      setMessage("No tag code was found in this photo. Hold the phone square to the tag, in good light, and try again.");
    }
  }

  return (
    <div className="space-y-5">
      {message ? <Notice tone="caution">{message}</Notice> : null}
      <div id="tag-reader" className="mx-auto max-w-sm overflow-hidden rounded-card" aria-live="polite" />
      <div id="tag-reader-file" className="hidden" />
      {!scanning ? (
        <Button size="lg" className="w-full" onClick={startCamera}>
          Scan with the camera
        </Button>
      ) : (
        <Button size="lg" variant="secondary" className="w-full" onClick={() => void scanner.current?.stop().then(() => setScanning(false))}>
          Stop the camera
        </Button>
      )}
      <div className="flex flex-col gap-1">
        <label htmlFor="tag-photo" className="font-bold">
          Or scan a photo of the tag
        </label>
        <input id="tag-photo" type="file" accept="image/*" capture="environment" className={`${inputClasses} min-h-touch`} onChange={scanPhoto} />
      </div>
      <form
        className="flex flex-col gap-1"
        onSubmit={(e) => {
          e.preventDefault();
          const code = normaliseTagCode(typed);
          if (code) router.push(`/points/${code}`);
          else setMessage("A tag code has 8 letters and digits, for example K7QX3MPA.");
        }}
      >
        <label htmlFor="tag-code" className="font-bold">
          Or type the code under the QR
        </label>
        <div className="flex gap-2">
          <input id="tag-code" autoCapitalize="characters" autoComplete="off" className={`${inputClasses} min-h-touch font-mono text-lg uppercase`} value={typed} onChange={(e) => setTyped(e.target.value)} />
          <Button type="submit" size="lg">
            Open
          </Button>
        </div>
      </form>
    </div>
  );
}
