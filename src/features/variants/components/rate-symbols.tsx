/** kcat and Km typeset as the trade prints them (italic symbol, roman subscript), for headings and terms. */
export function KcatSymbol() {
  return (
    <span className="normal-case">
      <i>k</i>
      <sub>cat</sub>
    </span>
  );
}

export function KmSymbol() {
  return (
    <span className="normal-case">
      <i>K</i>
      <sub>m</sub>
    </span>
  );
}

export function KcatOverKmSymbol() {
  return (
    <span className="normal-case">
      <KcatSymbol />/<KmSymbol />
    </span>
  );
}
