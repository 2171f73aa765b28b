import type { Metadata } from "next";
import { notFound, redirect } from "next/navigation";
import { can } from "@/lib/auth/permissions";
import { roleLabels } from "@/lib/auth/roles";
import { currentUser } from "@/lib/auth/session";
import { listUsers } from "@/lib/data/users";
import { CreateUserForm } from "./CreateUserForm";

export const metadata: Metadata = { title: "Users" };
export const dynamic = "force-dynamic";

export default async function UsersPage() {
  const user = await currentUser();
  if (!user) redirect("/signin");
  if (!can(user.role, "user:manage")) notFound();
  const users = await listUsers();
  return (
    <section className="grid gap-6 lg:grid-cols-[2fr_1fr]">
      <div>
        <h1 className="mb-4 text-2xl font-semibold">Users</h1>
        <div className="overflow-x-auto rounded border border-soil-200 bg-white">
          <table className="w-full text-left text-sm">
            <thead className="bg-soil-100 text-soil-700">
              <tr>
                <th className="px-3 py-2">Name</th>
                <th className="px-3 py-2">E-mail</th>
                <th className="px-3 py-2">Role</th>
              </tr>
            </thead>
            <tbody>
              {users.map((row) => (
                <tr key={row.id} className="border-t border-soil-100" data-testid="user-row">
                  <td className="px-3 py-2">{row.name}</td>
                  <td className="px-3 py-2">{row.email}</td>
                  <td className="px-3 py-2">{roleLabels[row.role]}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </div>
      <CreateUserForm />
    </section>
  );
}
