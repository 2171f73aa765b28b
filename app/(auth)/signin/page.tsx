import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { currentUser } from "@/lib/auth/session";
import { returnPathSchema } from "@/lib/validations/auth";
import { SignInForm } from "./SignInForm";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ callbackUrl?: string }> }) {
  const { callbackUrl } = await searchParams;
  // Only same-site paths: a crafted callbackUrl must not send people elsewhere.
  const target = returnPathSchema.parse(callbackUrl);
  if (await currentUser()) redirect(target);
  return <SignInForm callbackUrl={target} />;
}
