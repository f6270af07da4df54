"use client";

import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";

export default function SectionError({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <div className="max-w-xl space-y-4">
      <Notice tone="danger" title="This page could not be shown">
        Something went wrong while loading it. Nothing you entered was half-saved. Try again; if it keeps
        happening, tell your administrator the time it happened.
      </Notice>
      <Button onClick={reset}>Try again</Button>
    </div>
  );
}
