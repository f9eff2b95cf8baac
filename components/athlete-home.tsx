import { MyProgress } from "@/components/progress/my-progress";

/** The athlete's home: My progress, or why there is nothing to show yet. */
export function AthleteHome({ linked, name }: { linked: boolean; name: string }) {
  return (
    <section aria-labelledby="progress-heading" className="space-y-4">
      <div>
        <h1 id="progress-heading" className="text-2xl font-bold">
          My progress
        </h1>
        <p className="text-ink-soft">
          Hello {name}. Your results appear here once your sport scientist publishes a testing session. You see only
          your own results; nobody else&apos;s.
        </p>
      </div>
      {linked ? (
        <MyProgress />
      ) : (
        <p className="card p-4">Your account is not linked to an athlete record yet. Ask your coach to link it.</p>
      )}
      <p className="text-xs text-ink-soft">
        These numbers support training decisions; they are not a medical or return-to-play judgement. Talk to your
        medical staff about any health question.
      </p>
    </section>
  );
}
