export function meta() {
  return [{ title: "Sparwise" }];
}

export default function Home() {
  return (
    <main className="mx-auto max-w-3xl p-8">
      <h1 className="text-3xl font-bold">Sparwise</h1>
      <p className="mt-2">Find the lightest buildable beam section for a moment and shear, and have it checked.</p>
    </main>
  );
}
