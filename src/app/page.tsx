import Link from "next/link";

export default function Home() {
  return (
    <main className="mx-auto max-w-3xl px-6 py-16">
      <h1 className="text-3xl font-semibold tracking-tight text-steel">Knucklebench</h1>
      <p className="mt-4 text-lg leading-relaxed text-ink/80">
        Lay out the front corner of a small driven car — arms, knuckle and kingpin, steering arm and tie rod, drive
        shaft and joint — and learn before you print how far it steers before the shaft neck meets the cup, what angle
        the joint runs at over steer and travel, how camber and roll centre move, how much Ackermann you have, and
        whether the shaft survives the motor&apos;s torque.
      </p>
      <div className="mt-8 flex gap-3">
        <Link href="/kits" className="rounded-md bg-steel px-4 py-2 text-sm font-medium text-white hover:bg-[#2f4a60]">Open your kits</Link>
        <Link href="/sign-up" className="rounded-md border border-ink/20 bg-white px-4 py-2 text-sm font-medium hover:bg-ink/5">Create an account</Link>
        <Link href="/methods" className="rounded-md border border-ink/20 bg-white px-4 py-2 text-sm font-medium hover:bg-ink/5">Methods and sources</Link>
      </div>
      <section aria-labelledby="cautions" className="mt-12 rounded-lg border border-amber-300 bg-amber-50 p-4 text-sm text-amber-950">
        <h2 id="cautions" className="font-semibold">Cautions</h2>
        <ul className="mt-2 list-disc space-y-1 pl-5">
          <li>Strength figures are estimates: printed parts vary with layer direction, infill, temperature and moisture.</li>
          <li>A drivetrain spun up on the bench can throw fragments: guard it and wear eye protection.</li>
          <li>This is a design aid for models, not a sign-off for full-size or road vehicles: defer to local codes and licensed practice.</li>
        </ul>
      </section>
    </main>
  );
}
