import Link from "next/link";
import { Notice } from "@/components/ui/notice";

/** Shown when a signed-in person opens a section their role may not use. */
export function Forbidden({ what }: { what: string }) {
  return (
    <div className="max-w-xl">
      <Notice tone="caution" title="Not available to your role">
        <p>
          {what} is not part of your role. If you need it, ask an administrator to change your role.{" "}
          <Link href="/overview">Back to the overview</Link>.
        </p>
      </Notice>
    </div>
  );
}
