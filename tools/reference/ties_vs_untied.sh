#!/bin/bash
# ties_vs_untied.sh — whole command-line runs of the exact p-value on untied
# scores and on the same scores with a few ties, side by side: for each size
# pattern and tie pattern the median wall time (ms) and peak memory (RSS) of
# five runs, and the p-value method the run used. The data are synthetic ranks
# (values 10 + 3·rank, a tie repeating a rank's value), dealt into groups in a
# fixed shuffled order; nothing here is a check value.
#
# usage: tools/reference/ties_vs_untied.sh [midrank flags]
#   e.g. --pvalue exact (the explicit request) or none (the automatic choice)
set -euo pipefail
root=$(cd "$(dirname "$0")/../.." && pwd)
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
(cd "$root" && go build -o "$work/midrank" ./tools/midrank)

# write FILE SIZES TIE AT...: SIZES like 6,6,6,6; TIE the run length (1 for
# untied, 2 pairs, 3 triples) starting at each rank in AT
write() {
	local file=$1 sizes=$2 tie=$3
	shift 3
	awk -v sizes="$sizes" -v tie="$tie" -v at="$*" 'BEGIN {
		k = split(sizes, n, ","); N = 0
		for (i = 1; i <= k; i++) for (j = 0; j < n[i]; j++) g[N++] = "G" i
		srand(7)
		for (i = N - 1; i > 0; i--) { j = int(rand() * (i + 1)); t = g[i]; g[i] = g[j]; g[j] = t }
		split(at, starts, " "); for (s in starts) start[starts[s]] = 1
		m = 0
		for (r = 1; r <= N; ) {
			len = (r in start) ? tie : 1
			for (c = 0; c < len; c++) v[m++] = 10 + 3 * r
			r += len
		}
		print "site,minutes"
		for (i = 0; i < N; i++) print g[i] "," v[i]
	}' >"$file"
}

run() { # run NAME FILE FLAGS...: median time and peak memory of five runs
	local name=$1 file=$2
	shift 2
	if ! "$work/midrank" "$@" "$file" >"$work/out" 2>&1; then
		printf '%-28s refused: %s\n' "$name" "$(head -1 "$work/out")"
		return
	fi
	local method
	method=$(sed -n 's/.*p [=<] [.0-9]* (\([^)]*\)).*/\1/p' "$work/out" | head -1)
	local start end
	for _ in 1 2 3 4 5; do
		start=$(date +%s%N)
		/usr/bin/time -f "%M" -o "$work/time" "$work/midrank" "$@" "$file" >/dev/null
		end=$(date +%s%N)
		echo "$(((end - start) / 1000000)) $(cat "$work/time")"
	done >"$work/runs"
	local ms kb
	ms=$(cut -d' ' -f1 "$work/runs" | sort -n | sed -n 3p)
	kb=$(cut -d' ' -f2 "$work/runs" | sort -n | sed -n 3p)
	printf '%-28s %6d ms %6d MB  %s\n' "$name" "$ms" $((kb / 1024)) "$method"
}

for sizes in 6,6,6,6 8,8,8,8 5,5,5,5,5 15,15,15; do
	n=$(echo "$sizes" | tr , '\n' | awk '{s += $1} END {print s}')
	write "$work/untied.csv" "$sizes" 1
	write "$work/one-pair.csv" "$sizes" 2 $((n * 2 / 5))
	write "$work/two-pairs.csv" "$sizes" 2 3 $((n * 2 / 3))
	write "$work/five-pairs.csv" "$sizes" 2 3 $((n / 4)) $((n * 2 / 5)) $((n * 3 / 5)) $((n * 4 / 5))
	write "$work/two-triples.csv" "$sizes" 3 $((n / 3)) $((n * 2 / 3))
	for t in untied one-pair two-pairs five-pairs two-triples; do
		run "($sizes) $t" "$work/$t.csv" "$@"
	done
done
