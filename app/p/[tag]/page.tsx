import { redirect } from "next/navigation";
import { normaliseTagCode } from "@/lib/domain/service";

/** What a tag's QR code opens: the point's service page (sign-in first when needed, then straight on). */
export default async function TagRedirect({ params }: { params: Promise<{ tag: string }> }) {
  const { tag } = await params;
  const code = normaliseTagCode(tag);
  redirect(code ? `/points/${code}` : "/scan");
}
