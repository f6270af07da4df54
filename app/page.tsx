import { redirect } from "next/navigation";
import { getCurrentSession } from "@/lib/server/auth";

export default async function Home() {
  redirect((await getCurrentSession()) ? "/overview" : "/sign-in");
}
