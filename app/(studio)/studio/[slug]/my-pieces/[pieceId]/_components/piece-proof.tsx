import type { ProofSpreadView } from "@/server/proofs";

/**
 * "Your piece in the book": the reader spreads the piece sits on, its own pages as thumbnails and
 * each facing page beside it. A neighbour's artwork shows only when that neighbour is public,
 * which here means its contributor approved their credit line (lib/auth/policy.ts
 * pieceIsPublic); until then only its title is shown.
 */
export function PieceProof({ spreads }: { spreads: ProofSpreadView[] }) {
  return (
    <section
      aria-labelledby="proof-heading"
      className="flex flex-col gap-3"
      data-testid="piece-proof"
    >
      <h2 id="proof-heading" className="text-xl font-semibold">
        Your piece in the book
      </h2>
      {spreads.length === 0 ? (
        <p className="text-sm text-ink-soft" data-testid="proof-not-placed">
          Not on the page map yet. Once the editors place it, its spread shows here with the pages
          beside it.
        </p>
      ) : (
        <>
          <p className="max-w-2xl text-sm text-ink-soft">
            A rough proof from the page map as it stands (it may still change). Other contributors’
            artwork shows once they have approved their credit; before that you see the title.
          </p>
          <ol className="flex flex-wrap gap-6">
            {spreads.map((spread) => (
              <li key={spread.label} className="flex flex-col gap-1" data-testid="proof-spread">
                <span className="text-xs text-ink-faint">{spread.label}</span>
                <div className="flex">
                  {spread.pages.map((page) => (
                    <figure
                      key={page.page}
                      className={`flex h-48 w-32 flex-col border border-ink/20 p-1 text-xs ${
                        page.kind === "own" ? "bg-teal-light/60" : "bg-white"
                      }`}
                      data-testid={`proof-page-${page.page}`}
                      data-kind={page.kind}
                      data-public={page.isPublic === null ? "" : String(page.isPublic)}
                    >
                      <div className="flex min-h-0 flex-1 items-center justify-center overflow-hidden bg-paper">
                        {page.imageUrl ? (
                          <img
                            src={page.imageUrl}
                            alt={page.alt}
                            className="max-h-full max-w-full object-contain"
                            loading="lazy"
                          />
                        ) : (
                          <span className="px-1 text-center text-ink-soft">
                            {page.kind === "neighbour"
                              ? "Artwork shown once approved"
                              : page.kind === "own"
                                ? "No preview yet"
                                : ""}
                          </span>
                        )}
                      </div>
                      <figcaption className="mt-1 leading-tight">
                        <span className="font-mono text-ink-faint">p. {page.page}</span>{" "}
                        <span className={page.kind === "own" ? "font-semibold" : ""}>
                          {page.kind === "own" ? "Yours: " : ""}
                          {page.label}
                        </span>
                        {page.partOf ? (
                          <span className="text-ink-soft"> ({page.partOf})</span>
                        ) : null}
                      </figcaption>
                    </figure>
                  ))}
                </div>
              </li>
            ))}
          </ol>
        </>
      )}
    </section>
  );
}
