/** "· ✓ won" after the winner's name: a word and a shape, never colour alone. */
export function WonMark() {
  return (
    <span>
      {' '}
      · <span aria-hidden="true">✓ </span>won
    </span>
  );
}
