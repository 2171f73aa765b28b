import type { Metadata } from "next";
import { RegisterForm } from "./RegisterForm";

export const metadata: Metadata = { title: "Create a grower account" };

export default function RegisterPage() {
  return <RegisterForm />;
}
