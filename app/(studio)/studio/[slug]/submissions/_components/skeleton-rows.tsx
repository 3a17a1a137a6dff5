/** Grey bars in place of rows while the first page loads. */
export function SkeletonRows({ columns }: { columns: number }) {
  return (
    <>
      {Array.from({ length: 6 }, (_, i) => (
        <tr
          key={i}
          className="border-t border-ink/10"
          data-testid="submissions-loading"
          aria-hidden="true"
        >
          {Array.from({ length: columns }, (_, j) => (
            <td key={j} className="px-3 py-3">
              <span
                className="block h-3 animate-pulse rounded bg-ink/10"
                style={{ width: j === 0 ? 16 : `${50 + ((i * 7 + j * 13) % 40)}%` }}
              />
            </td>
          ))}
        </tr>
      ))}
    </>
  );
}
