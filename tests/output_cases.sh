#!/bin/sh
# End-to-end cases of how coilfit writes its files (src/io/output.hpp) and of the flags and
# folders around them. Each case runs in its own scratch folder in the build tree, on files,
# links and FIFOs the case makes itself (never the system's /dev/null or other devices).
#   sh output_cases.sh CASE COILFIT SCRATCH EXAMPLES PARTS
# Expected messages are this project's own contract (architecture doc, "Errors").
set -u
here=$(cd "$(dirname "$0")" && pwd)
case_name=$1
exe=$2
scratch=$3/$case_name
examples=$4
parts=$5
export COILFIT_PARTS="$parts" NO_COLOR=1

rm -rf "$scratch"
mkdir -p "$scratch"
cd "$scratch" || exit 1
cp "$examples/greenhouse-valve.json" spec.json

fail() {
    echo "FAIL ($case_name): $*" >&2
    exit 1
}
# run EXPECTED_RC ARGS...: runs coilfit, keeps stdout in out.txt and stderr in err.txt.
run() {
    want=$1
    shift
    "$exe" "$@" >out.txt 2>err.txt
    got=$?
    [ "$got" = "$want" ] || fail "exit $got, expected $want: $* ($(cat err.txt))"
}
first_err() { head -n 1 err.txt; }
expect_err() { [ "$(first_err)" = "$1" ] || fail "stderr is '$(first_err)', expected '$1'"; }
# A usage error from the argument library: the same words, with or without the program's prefix.
expect_usage_err() {
    # One line, "coilfit: error: " + the message + the help hint " (see coilfit CMD --help)".
    case "$(first_err)" in
        "coilfit: error: $1 (see coilfit "*" --help)") ;;
        *) fail "stderr is '$(first_err)', expected 'coilfit: error: $1 (see coilfit ... --help)'" ;;
    esac
}
sum() { cksum <"$1"; }
mode() { stat -c %a "$1"; }
no_temp() { ! ls -A "${1:-.}" | grep -q 'coilfit-' || fail "a temporary file was left: $(ls -A "${1:-.}")"; }
is_report() { grep -q '^coilfit .* - greenhouse irrigation valve relay K2' "$1" || fail "$1 does not hold the report"; }

case $case_name in
dash-is-stdout)
    run 0 size spec.json -o -
    is_report out.txt
    [ ! -e ./- ] || fail "a file named - was written"
    ;;
fifo-written-not-replaced)
    mkfifo pipe
    cat pipe >got.txt &
    reader=$!
    run 0 size spec.json -o pipe
    wait $reader
    [ -p pipe ] || fail "the FIFO was replaced"
    is_report got.txt
    no_temp
    ;;
dev-stdout-on-a-pipe)
    # Standard output is a pipe here: /dev/stdout is opened and written, never replaced.
    "$exe" size spec.json -o /dev/stdout 2>err.txt | cat >got.txt
    is_report got.txt
    [ -L /dev/stdout ] || fail "/dev/stdout is no longer a link"
    ;;
mode-kept)
    echo old >r.txt
    chmod 600 r.txt
    run 0 size spec.json -o r.txt
    [ "$(mode r.txt)" = 600 ] || fail "a 0600 file came back $(mode r.txt)"
    is_report r.txt
    no_temp
    ;;
new-file-follows-umask)
    umask 027
    run 0 size spec.json -o new.txt
    [ "$(mode new.txt)" = 640 ] || fail "a new file under umask 027 is $(mode new.txt)"
    ;;
link-written-through)
    mkdir real
    echo old >real/target.txt
    chmod 640 real/target.txt
    ln -s real/target.txt link.txt
    run 0 size spec.json -o link.txt
    [ -L link.txt ] || fail "the link was replaced by a file"
    [ "$(readlink link.txt)" = real/target.txt ] || fail "the link changed"
    is_report real/target.txt
    [ "$(mode real/target.txt)" = 640 ] || fail "the target's mode changed"
    no_temp
    no_temp real
    ;;
dangling-link-creates-target)
    ln -s made.txt link.txt
    run 0 size spec.json -o link.txt
    [ -L link.txt ] || fail "the link was replaced"
    is_report made.txt
    ;;
link-loop)
    ln -s l2 l1
    ln -s l1 l2
    run 2 size spec.json -o l1
    expect_err "coilfit: error: l1: a symbolic link loop; give a file name"
    ;;
long-name)
    name=$(printf '%0250d' 0 | tr 0 n)
    run 0 size spec.json -o "$name"
    is_report "$name"
    no_temp
    ;;
folder-is-an-error)
    mkdir out
    run 2 size spec.json -o out
    expect_err "coilfit: error: --output: out is a folder; give a file name"
    grep -q Success err.txt && fail "the message says Success"
    run 2 size spec.json --netlist out/
    expect_err "coilfit: error: --netlist: out/ is a folder; give a file name"
    ;;
output-is-the-spec)
    before=$(sum spec.json)
    run 2 size spec.json -o spec.json
    expect_err "coilfit: error: --output: spec.json is an input of this run; coilfit never writes over what it reads"
    run 2 size spec.json --netlist ./spec.json
    expect_err "coilfit: error: --netlist: ./spec.json is an input of this run (the same file as spec.json); coilfit never writes over what it reads"
    ln -s spec.json alias.json
    run 2 pick spec.json -o alias.json
    expect_err "coilfit: error: --output: alias.json is an input of this run (the same file as spec.json); coilfit never writes over what it reads"
    run 2 yield spec.json --samples 10 -o alias.json
    [ "$(sum spec.json)" = "$before" ] || fail "the spec changed"
    [ -L alias.json ] || fail "the link was replaced"
    ;;
output-is-a-parts-file)
    mkdir table
    cp "$parts"/*.json table/
    before=$(sum table/diodes.json)
    run 2 size spec.json --parts table -o table/diodes.json
    expect_err "coilfit: error: --output: table/diodes.json is an input of this run; coilfit never writes over what it reads"
    run 2 size spec.json --parts table/diodes.json --netlist table/diodes.json
    [ "$(sum table/diodes.json)" = "$before" ] || fail "the parts file changed"
    ;;
two-outputs-one-file)
    run 2 size spec.json -o x.txt --netlist x.txt
    expect_err "coilfit: error: --netlist: x.txt is also the file of --output; give each output its own file"
    [ ! -e x.txt ] || fail "something was written"
    echo keep >y.txt
    ln -s y.txt y-link.txt
    run 2 size spec.json -o y-link.txt --netlist y.txt
    [ "$(cat y.txt)" = keep ] || fail "y.txt changed"
    run 2 size spec.json --netlist p.svg --plot ./p.svg
    expect_err "coilfit: error: --plot: ./p.svg is also the file of --netlist; give each output its own file"
    run 2 size spec.json --plot spec.json
    expect_err "coilfit: error: --plot: spec.json is an input of this run; coilfit never writes over what it reads"
    [ ! -e p.svg ] || fail "something was written"
    run 2 size spec.json -o - --netlist /dev/stdout
    expect_err "coilfit: error: --netlist: /dev/stdout is also the file of --output; give each output its own file"
    ;;
repeated-flags-last-wins)
    run 0 size spec.json --format json --format text
    is_report out.txt
    run 0 size spec.json -o a.txt -o b.txt
    [ ! -e a.txt ] || fail "the first -o was written"
    is_report b.txt
    run 0 yield spec.json --samples 10 --samples 20 --format json
    grep -q '"samples": 20,' out.txt || fail "--samples 10 --samples 20 did not take 20"
    run 0 size spec.json --supply 24V --supply 12V --format json
    grep -q '"voltage": 12.0' out.txt || fail "--supply 24V --supply 12V did not take 12 V"
    ;;
top-whole-number)
    run 2 pick spec.json --top -1
    expect_usage_err '--top: expected a whole number from 0 to 1000000000, got "-1"'
    run 2 pick spec.json --top 1.5
    run 0 pick spec.json --top 0
    grep -q 'more (--top 0 lists all)' out.txt && fail "--top 0 did not list all"
    run 0 pick spec.json --top 1 --format json
    # (the spec has a load: the relay side's own list follows under "relays")
    [ "$(sed '/"relays":/,$d' out.txt | grep -c '"transistor":')" = 1 ] || fail "--top 1 did not list one"
    ;;
empty-names)
    run 2 size spec.json --parts ""
    expect_usage_err "--parts: expected a file name, got an empty text"
    run 2 size spec.json -o ""
    expect_usage_err "--output: expected a file name, got an empty text"
    run 2 size spec.json --netlist ""
    expect_usage_err "--netlist: expected a file name, got an empty text"
    ;;
parts-folder-entries)
    mkdir table
    cp "$parts"/*.json table/
    ln -s nowhere.json table/dangling.json
    run 2 parts --parts table
    expect_err "coilfit: error: table/dangling.json: a symbolic link to nothing in the parts folder; remove it or fix its target"
    rm table/dangling.json
    ln -s loop.json table/loop.json
    run 2 parts --parts table
    expect_err "coilfit: error: table/loop.json: a symbolic link loop in the parts folder"
    rm table/loop.json
    mkdir table/extra.json
    run 2 parts --parts table
    expect_err "coilfit: error: table/extra.json: a folder named *.json in the parts folder; parts files are files"
    rmdir table/extra.json
    mkfifo table/pipe.json
    run 2 parts --parts table
    expect_err "coilfit: error: table/pipe.json: not a regular file, in the parts folder"
    rm table/pipe.json
    ln -s table table-link
    run 0 parts --parts table-link
    ln -s l2 l1
    ln -s l1 l2
    run 2 parts --parts l1
    expect_err "coilfit: error: l1: a symbolic link loop"
    ;;
parts-folder-size-limit)
    # Sparse files: 5 x 7 MiB is more than the 32 MiB a parts folder may hold together, and
    # every file is within the 8 MiB each may hold; rejected before one is read.
    mkdir table
    for n in 1 2 3 4 5; do truncate -s 7M table/big$n.json; done
    run 2 parts --parts table
    expect_err "coilfit: error: table: the parts files of this folder are larger than 33554432 bytes together; this is not a coilfit parts table"
    ;;
hostile-file-names)
    # A file name with a terminal escape and one with a bidi override: shown escaped.
    esc=$(printf 'bad\033[2Jname.json')
    run 2 size "$esc"
    expect_err 'coilfit: error: bad\x1b[2Jname.json: cannot open the file'
    bidi=$(printf 'x\342\200\256nosj.json')
    run 2 size "$bidi"
    expect_err 'coilfit: error: x\u202enosj.json: cannot open the file'
    nl=$(printf 'two\nlines.json')
    run 2 size spec.json -o "$nl/x"
    [ "$(wc -l <err.txt)" = 1 ] || fail "a newline in a file name split the message"
    ;;
inline-labels)
    # An inline record reusing a table id (2N4401 with a gain of 5000) is never plain "2N4401".
    inl=$here/data/inline_2n4401.json
    run 0 size "$inl"
    grep -q 'transistor  *inline 2N4401 (npn' out.txt || fail "text report: $(grep transistor out.txt | head -1)"
    run 0 size "$inl" --format json
    grep -q '"label": "inline 2N4401"' out.txt || fail "JSON report lacks the label"
    run 0 size "$inl" --netlist n.cir
    grep -q '^\*   transistor inline 2N4401; clamp diode inline 1N4148' n.cir || fail "netlist comment"
    run 0 yield "$inl" --samples 100 --format json
    grep -q '"transistor": "inline 2N4401"' out.txt || fail "yield JSON"
    run 0 yield "$inl" --samples 100
    grep -q 'design  *inline 2N4401, .*clamp diode inline 1N4148' out.txt || fail "yield text"
    run 0 pick "$inl" --parts "$parts/bipolar.json" --top 1
    grep -q ' inline 1N4148 ' out.txt || fail "pick text"
    ;;
*)
    fail "unknown case"
    ;;
esac
exit 0
