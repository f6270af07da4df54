import { redirect } from "next/navigation";
import { normaliseTagCode } from "@/lib/domain/service";

/** What a container label's QR code opens: the lot's page (sign-in first when needed). */
export default async function ContainerRedirect({ params }: { params: Promise<{ code: string }> }) {
  const { code } = await params;
  const label = normaliseTagCode(code);
  redirect(label ? `/stock/lots/${label}` : "/stock");
}
