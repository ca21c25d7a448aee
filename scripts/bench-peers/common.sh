# Sourced by scripts/bench-load and scripts/bench-knn: installs the peers from Debian's packages,
# times whole processes, reads package versions, checks figures against nearfit's.

# bench_install PACKAGE...: installs the Debian packages not yet installed (one apt-get update first).
bench_install() {
  local missing=() p
  for p in "$@"; do
    dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q 'install ok installed' || missing+=("$p")
  done
  [ ${#missing[@]} -eq 0 ] && return 0
  echo "bench: installing ${missing[*]} ..." >&2
  apt-get update -qq >&2
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "${missing[@]}" >/dev/null
}

bench_pkgver() { dpkg-query -W -f='${Version}' "$1" 2>/dev/null || echo unknown; }

# bench_wall OUT COMMAND...: runs COMMAND (a fresh process) with standard output to OUT; prints its wall seconds.
bench_wall() {
  local out=$1 t0 t1; shift
  t0=$(date +%s%N)
  if ! "$@" > "$out" 2>/tmp/bench-wall.$$.err; then
    echo "bench: failed ($*):" >&2; cat /tmp/bench-wall.$$.err >&2; rm -f /tmp/bench-wall.$$.err; return 1
  fi
  t1=$(date +%s%N)
  rm -f /tmp/bench-wall.$$.err
  awk -v a="$t0" -v b="$t1" 'BEGIN {printf "%.4f\n", (b - a) / 1e9}'
}

bench_median() { sort -g | awk '{a[NR] = $1} END {if (NR % 2) print a[(NR + 1) / 2]; else printf "%.4f\n", (a[NR / 2] + a[NR / 2 + 1]) / 2}'; }

# bench_same A B REL: exit 0 when |A - B| <= REL * |B| (REL 0: the two must be equal as text).
bench_same() {
  [ -n "$1" ] && [ -n "$2" ] || return 1
  [ "$3" = 0 ] && { [ "$1" = "$2" ]; return; }
  awk -v a="$1" -v b="$2" -v r="$3" 'BEGIN {d = a - b; if (d < 0) d = -d; m = b < 0 ? -b : b; exit !(d <= r * m)}'
}

bench_machine() {
  echo "machine: nproc $(nproc), memory $(free -g | awk '/^Mem:/ {print $2}') GiB, $(uname -m), $(date -u '+%Y-%m-%d %H:%M UTC')"
}
