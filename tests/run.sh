#!/usr/bin/env bash
# The whole test suite, on a fresh machine: installs the outside references the tests check
# against (Debian packages, pinned Python libraries in a venv under target/), then runs
# every test. A reference that cannot be installed makes its test fail loudly, not skip.
set -euo pipefail
cd "$(dirname "$0")/.."

need=()
[ -f /usr/share/wordnet/verb.exc ] || need+=(wordnet-base)
[ -f /usr/share/snowball/data/english/voc.txt ] || need+=(snowball-data)
if [ ${#need[@]} -gt 0 ]; then
  sudo=""
  [ "$(id -u)" = 0 ] || sudo=sudo
  echo "installing reference data: ${need[*]}" >&2
  $sudo apt-get update -qq
  DEBIAN_FRONTEND=noninteractive $sudo apt-get install -y -qq "${need[@]}" >/dev/null
fi

venv=target/reference-venv
requirements=tests/reference/requirements.txt
stamp="$venv/.requirements"
if [ ! -x "$venv/bin/python" ] || ! cmp -s "$requirements" "$stamp"; then
  echo "installing Python reference libraries into $venv" >&2
  rm -rf "$venv"
  python3 -m venv "$venv"
  "$venv/bin/pip" install -q --disable-pip-version-check -r "$requirements"
  cp "$requirements" "$stamp"
fi
export LEXDELTA_PYTHON="$PWD/$venv/bin/python"

cargo test --locked
