import type { Metadata } from "next";
import { Forbidden } from "@/components/shell/forbidden";
import { PageHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { pageUserCan } from "@/lib/server/auth";

export const metadata: Metadata = { title: "Grease catalogue" };

export default async function Page() {
  const { allowed } = await pageUserCan("catalogue.read");
  if (!allowed) return <Forbidden what="The catalogue" />;
  return (
    <>
      <PageHeader title="Grease catalogue" lead="Every grease the plant uses: thickener, base oil, viscosity, NLGI grade and packs." />
      <EmptyState title="The catalogue is empty.">
        <p>The lubrication lead enters each grease product here, with its data sheets. The compatibility check compares greases from this catalogue before any mix reaches a bearing.</p>
      </EmptyState>
    </>
  );
}
