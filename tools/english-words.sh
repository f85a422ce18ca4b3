#!/usr/bin/env bash
# Writes src/understand/english-words.txt: the everyday English words of the
# SCOWL small British list as Debian's `wbritish-small` package ships it
# (lower-case alphabetic entries only; names and abbreviations are capitalised
# there and left out). The understander uses it so that a reader's ordinary
# word ("world", "mate") is never read, on its own, as a misspelt name.
set -euo pipefail
cd "$(dirname "$0")/.."
src=/usr/share/dict/british-english-small
if [ ! -e "$src" ]; then
  if [ "$(id -u)" = 0 ]; then SUDO=""; else SUDO="sudo"; fi
  $SUDO apt-get install -y -qq wbritish-small >/dev/null
fi
version=$(dpkg-query -W -f='${Version}' wbritish-small 2>/dev/null || echo unknown)
{
  echo "# Everyday English words: SCOWL small British list, Debian package wbritish-small $version,"
  echo "# lower-case alphabetic entries only. Regenerate with tools/english-words.sh."
  grep -E '^[a-z]+$' "$src" | LC_ALL=C sort -u
} > src/understand/english-words.txt
# The list's licence asks that its notice travel with every copy.
cp /usr/share/doc/wbritish-small/copyright src/understand/english-words.COPYING
wc -l src/understand/english-words.txt
