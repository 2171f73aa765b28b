import Link from "next/link";

export default function NotFound() {
  return (
    <div className="mx-auto max-w-lg px-4 py-16 text-center">
      <h1 className="text-2xl font-semibold">Not found</h1>
      <p className="mt-2 text-soil-700">That page does not exist, or it is not visible to your account.</p>
      <Link href="/" className="mt-4 inline-block text-leaf-700 underline">
        Back to the start
      </Link>
    </div>
  );
}
