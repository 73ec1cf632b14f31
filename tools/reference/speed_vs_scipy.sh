#!/usr/bin/env bash
# Times the whole midrank command line against pandas.read_csv +
# scipy.stats.kruskal on the same file of 1,000,000 values in 5 groups, side
# by side (in turn, seven rounds), and prints the ratio and midrank's peak
# memory. Needs
# Debian's python3 with python3-pandas and python3-scipy; exits 0 with a
# note when they are missing. Usage: tools/reference/speed_vs_scipy.sh [N]
set -euo pipefail
cd "$(dirname "$0")/../.."
n=${1:-1000000}
py=/usr/bin/python3
if ! "$py" -c 'import pandas, scipy' 2>/dev/null; then
  echo "python3 with pandas and scipy is not installed (apt-get install python3-pandas python3-scipy); nothing measured"
  exit 0
fi
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
go build -trimpath -o "$work/midrank" ./tools/midrank
"$py" - "$n" "$work/data.csv" <<'PY'
import sys
import numpy as np
n, path = int(sys.argv[1]), sys.argv[2]
rng = np.random.default_rng(20261202)
groups = np.array(["North clinic", "South clinic", "East clinic", "West clinic", "Central clinic"])
g = np.arange(n) % 5
v = np.floor((rng.exponential(30, n) + g) * 10) / 10
with open(path, "w") as f:
    f.write("site,minutes\n")
    for label, value in zip(groups[g], v):
        f.write(f"{label},{value}\n")
PY
cat > "$work/kw.py" <<'PY'
import sys
import pandas
from scipy import stats
d = pandas.read_csv(sys.argv[1])
h, p = stats.kruskal(*[s.values for _, s in d.groupby("site", sort=False)["minutes"]])
print(h, p)
PY
median() { sort -n | awk '{a[NR]=$1} END {print a[int((NR+1)/2)]}'; }
ms() { # command... → its wall time in ms
  local s e
  s=$(date +%s%N); "$@" > /dev/null; e=$(date +%s%N)
  echo $(( (e - s) / 1000000 ))
}
# the three commands in turn, seven rounds, each round starting with the
# next one (whichever runs right after pandas finds the caches cold), so that
# the machine's load, which drifts, weighs on each alike; medians of the
# rounds
run() {
  case $1 in
    0) ms "$work/midrank" --json --posthoc none "$work/data.csv" >> "$work/ours" ;; # like for like: the H test alone (scipy computes no pairs)
    1) ms "$work/midrank" --json "$work/data.csv" >> "$work/full" ;;
    2) ms "$py" "$work/kw.py" "$work/data.csv" >> "$work/theirs" ;;
  esac
}
for round in 0 1 2 3 4 5 6; do
  for i in 0 1 2; do run $(( (round + i) % 3 )); done
done
ours=$(median < "$work/ours")
full=$(median < "$work/full")
theirs=$(median < "$work/theirs")
peak=$(/usr/bin/time -f %M "$work/midrank" --json --posthoc none "$work/data.csv" 2>&1 >/dev/null | tail -1)
echo "values: $n ($(du -h "$work/data.csv" | cut -f1) of text)"
echo "midrank --json --posthoc none (whole process): ${ours} ms, peak memory $((peak / 1024)) MB"
echo "midrank --json with the default Dunn pairs and their effect sizes: ${full} ms"
echo "pandas.read_csv + scipy.stats.kruskal (whole process): ${theirs} ms"
awk -v a="$ours" -v b="$theirs" 'BEGIN { printf "midrank --posthoc none takes %.2f of the time (target: at most 0.20)\n", a / b }'
awk -v a="$full" -v b="$theirs" 'BEGIN { printf "midrank with its default pairs takes %.2f of the time (target: at most 0.15)\n", a / b }'
echo "same H from both:"; "$work/midrank" --json "$work/data.csv" | "$py" -c 'import json,sys; r=json.load(sys.stdin); print(r["h"], r["p_value"])'
"$py" "$work/kw.py" "$work/data.csv"
