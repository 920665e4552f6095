import type { Metadata } from "next";
import { NewWorkspaceForm } from "./new-workspace-form";

export const metadata: Metadata = { title: "New workspace" };

export default function NewWorkspacePage() {
  return (
    <div className="max-w-md rounded-lg border border-ink/10 bg-white p-5">
      <NewWorkspaceForm />
    </div>
  );
}
