#!/usr/bin/env bash
# Kill-and-resume soak: SIGKILLs a small search at random moments, resumes it each time, and checks the store.
#   bench/soak/soak.sh [CYCLES=20] [TRIALS=800] [--no-reference]
# Reports: cycles, store opened every time, trials lost (must be 0), duplicates (must be 0), and whether the
# resumed search equals an uninterrupted run of the same definition (one slot, same seed).
# FOLDWISE_DLL points at foldwise.dll (default: the Release build of src/Foldwise.Cli, built if missing).
# Exit 0 only when nothing was lost, nothing duplicated, the store always opened and the search completed.
set -euo pipefail
cycles=${1:-20}
trials=${2:-800}
reference=yes
[[ "${3:-}" == "--no-reference" ]] && reference=no
here=$(cd "$(dirname "$0")" && pwd)
repo=$(cd "$here/../.." && pwd)
dll=${FOLDWISE_DLL:-$repo/src/Foldwise.Cli/bin/Release/net10.0/foldwise.dll}
if [[ ! -f "$dll" ]]; then
  dotnet build "$repo/src/Foldwise.Cli" -c Release -v quiet -nologo >&2
fi
py=/usr/bin/python3
fw() { dotnet "$dll" "$@"; }
export DOTNET_NOLOGO=1

work=$(mktemp -d /tmp/foldwise-soak.XXXXXX)
trap 'rm -rf "$work"' EXIT
cd "$work"
"$py" - <<'PY'
import math, random
random.seed(5)
with open('train.csv', 'w') as f:
    f.write('id,f1,f2,f3,f4,f5,y\n')
    for r in range(80):
        f1, f2, f3 = random.randint(0, 3), random.randint(0, 2), random.randint(0, 1)
        f.write(f'a{r},{f1},{f2},{f3},1,{f1},{math.exp(1 + 0.6*f1 + 0.4*f2 + 0.1*random.random()):.3f}\n')
with open('test.csv', 'w') as f:
    f.write('id,f5,f4,f3,f2,f1\n')
    for r in range(20):
        f.write(f'b{r},{r%4},1,{r%2},{r%3},{r%4}\n')
PY
cat > search.json <<JSON
{
  "name": "soak",
  "data": { "train": "train.csv", "test": "test.csv", "id": "id", "target": "y" },
  "folds": 3,
  "screening": { "min_nonzero": 2 },
  "families": { "lightgbm": { "min_leaf_rows": 3 }, "fasttree": { "min_leaf_rows": 3 } },
  "schedule": { "kind": "asha", "proposer": "random", "first_rung": 5, "full_budget": 15, "eta": 3 },
  "budget": { "trials": $trials }
}
JSON

# Compares a history snapshot with the previous one: prints "LOST DUPLICATES DONE".
check() {
  "$py" - "$1" "$2" <<'PY'
import json, sys
now = {t['id']: t for t in json.load(open(sys.argv[1]))}
before = json.load(open(sys.argv[2])) if sys.argv[2] != '-' else []
lost = sum(1 for t in before if t['state'] == 'done' and
           (t['id'] not in now or now[t['id']]['state'] != 'done' or now[t['id']]['score'] != t['score']))
keys = [(t['family'], t['budget'], t['rung'], json.dumps(t['parameters'], sort_keys=True)) for t in now.values()]
print(lost, len(keys) - len(set(keys)), sum(1 for t in now.values() if t['state'] == 'done'))
PY
}

checks=0 opened=0 lost=0 dupes=0 early=0 finished_before=0
prev=-
for ((c = 1; c <= cycles; c++)); do
  if [[ -f out/search.db ]] && fw history out --json > /dev/null 2>&1; then cmd=(resume out); else cmd=(run search.json --out out); fi
  # dotnet itself in the background (not a shell function's subshell), so the SIGKILL reaches the coordinator.
  dotnet "$dll" "${cmd[@]}" > "cycle$c.log" 2>&1 &
  pid=$!
  delay=$(printf '%d.%03d' $((1 + RANDOM % 9)) $((RANDOM % 1000)))
  sleep "$delay"
  if kill -0 "$pid" 2> /dev/null; then kill -9 "$pid"; else finished_before=$((finished_before + 1)); fi
  wait "$pid" 2> /dev/null || true
  if kill -0 "$pid" 2> /dev/null; then echo "cycle $c: a foldwise process outlived its kill" >&2; exit 2; fi
  if [[ ! -f out/search.db ]]; then
    early=$((early + 1)); echo "cycle $c: killed after ${delay}s (${cmd[0]}), before the store existed"; continue
  fi
  checks=$((checks + 1))
  if fw history out --json > "snap$c.json" 2> "snap$c.err"; then
    opened=$((opened + 1))
    read -r l d done < <(check "snap$c.json" "$prev")
    lost=$((lost + l)); dupes=$((dupes + d)); prev="snap$c.json"
    echo "cycle $c: killed after ${delay}s (${cmd[0]}): store opened, $done done, lost $l, duplicates $d"
  elif grep -q "no search header\|no trial ran" "snap$c.err" "cycle$c.log"; then
    opened=$((opened + 1)); early=$((early + 1)); echo "cycle $c: killed after ${delay}s (${cmd[0]}), before the first record"
  else
    echo "cycle $c: killed after ${delay}s: STORE DID NOT OPEN: $(cat "snap$c.err")"
  fi
done

if fw history out --json > /dev/null 2>&1; then final_cmd=(resume out); else final_cmd=(run search.json --out out); fi
fw "${final_cmd[@]}" > final.log 2>&1 && final_rc=0 || final_rc=$?
fw history out --json > final.json
read -r l d done < <(check final.json "$prev")
lost=$((lost + l)); dupes=$((dupes + d))
rows=0
[[ -f out/predictions.csv ]] && rows=$(($(wc -l < out/predictions.csv) - 1))
[[ $final_rc -eq 0 ]] || { echo "final ${final_cmd[0]} failed:"; tail -5 final.log; }
same=skipped
if [[ $reference == yes ]]; then
  fw run search.json --out ref > ref.log 2>&1
  fw history ref --json > ref.json
  same=$("$py" - <<'PY'
import json
pick = lambda f: sorted((t['id'], t['family'], t['budget'], t['rung'], t['parent'], t['score'], json.dumps(t['parameters'], sort_keys=True)) for t in json.load(open(f)))
a, b = pick('final.json'), pick('ref.json')
print('yes' if a == b else f'NO ({sum(x != y for x, y in zip(a, b))} of {len(a)} trials differ)')
PY
)
fi

echo "cycles: $cycles ($early killed before the first trial record, $finished_before ended before their kill)"
echo "store opened every time: $([[ $opened -eq $checks ]] && echo yes || echo NO) ($opened of $checks cycles that had a store)"
echo "trials lost: $lost"
echo "duplicates: $dupes"
echo "final resume: exit $final_rc, $done of $trials trials done, predictions.csv rows: $rows of 20"
echo "same trials and scores as an uninterrupted run: $same"
[[ $opened -eq $checks && $lost -eq 0 && $dupes -eq 0 && $final_rc -eq 0 && $done -eq $trials && $rows -eq 20 && $same != NO* ]]
