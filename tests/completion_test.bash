#!/usr/bin/env bash
# The bash completion, called as bash calls it: source the script, fill COMP_WORDS and
# COMP_CWORD, call _coilfit, compare COMPREPLY with what it must hold. Part ids are checked
# against the table files themselves (the top-level "id" of every record), read here directly.
#   bash completion_test.bash SCRIPT COILFIT PARTS_DIR
set -u
script=$1 prog=$2 parts=$3
# shellcheck source=/dev/null
source "$script"
failures=0

# complete WORD... : COMPREPLY for the last word, sorted, one a line.
complete_words() {
    COMP_WORDS=("$prog" "$@")
    COMP_CWORD=$#
    COMPREPLY=()
    _coilfit
    printf '%s\n' "${COMPREPLY[@]}" | sort
}

# The ids of the records of some table files: their top-level "id" (records are indented 4).
table_ids() {
    local f
    for f in "$@"; do sed -n 's/^    "id": "\([^"]*\)",\{0,1\}$/\1/p' "$parts/$f"; done | sort
}

expect_same() {  # NAME EXPECTED ACTUAL
    if [[ "$2" != "$3" ]]; then
        printf 'FAIL %s\n--- expected:\n%s\n--- got:\n%s\n' "$1" "$2" "$3"
        failures=$((failures + 1))
    else
        printf 'ok   %s (%s)\n' "$1" "$(echo "$3" | wc -l) words"
    fi
}

expect_has() {  # NAME WORD ACTUAL
    if ! grep -qx -- "$2" <<<"$3"; then
        printf 'FAIL %s: "%s" not offered; got:\n%s\n' "$1" "$2" "$3"
        failures=$((failures + 1))
    else
        printf 'ok   %s\n' "$1"
    fi
}

expect_same "subcommands" "$(printf '%s\n' board parts pick size yield)" "$(complete_words '')"
expect_same "subcommand prefix" "$(printf '%s\n' pick parts | sort)" "$(complete_words p)"
expect_same "--transistor: every transistor of the table" "$(table_ids bipolar.json nmos.json arrays.json)" \
    "$(complete_words size --transistor '')"
expect_same "--diode: every diode" "$(table_ids diodes.json)" "$(complete_words size --diode '')"
expect_same "--zener: every zener" "$(table_ids zeners.json)" "$(complete_words pick --zener '')"
expect_same "--tvs: every TVS" "$(table_ids tvs.json)" "$(complete_words size --tvs '')"
expect_same "--coil-preset: every coil preset" "$(table_ids coils.json)" "$(complete_words size --coil-preset '')"
expect_same "--pin-preset: every pin preset" "$(table_ids pins.json)" "$(complete_words yield x.json --pin-preset '')"
expect_same "--transistor 2N44: the ids that start so" "$(table_ids bipolar.json nmos.json arrays.json | grep '^2N44')" \
    "$(complete_words size --transistor 2N44)"
expect_same "--parts PATH is followed" "$(table_ids zeners.json)" \
    "$(complete_words size --parts "$parts/zeners.json" --zener '')"
expect_same "--format" "$(printf '%s\n' json text)" "$(complete_words size --format '')"
expect_has "size flags: --coil-resistance" --coil-resistance "$(complete_words size --coil-)"
expect_has "size flags: --strict" --strict "$(complete_words size x.json --st)"
expect_has "yield flags: --samples" --samples "$(complete_words yield --sa)"
expect_has "pick flags: --top" --top "$(complete_words pick --to)"
expect_same "parts kinds: z" "zener" "$(complete_words parts z)"

if ((failures > 0)); then
    echo "$failures completion check(s) failed"
    exit 1
fi
