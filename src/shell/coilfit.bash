# bash completion for coilfit                                      -*- shell-script -*-
# Installed as share/bash-completion/completions/coilfit. Flags come from the program's own
# --help screens and part ids from `coilfit parts KIND --format json`, both asked of the
# program being completed, so they follow the version and the parts table in use (--parts,
# COILFIT_PARTS).

# The ids of one kind of the table: _coilfit_ids PROG KIND [--parts PATH]
_coilfit_ids() {
    local prog=$1 kind=$2
    shift 2
    "$prog" parts "$kind" --format json "$@" 2>/dev/null |
        sed -n 's/^ *"id": "\([^"]*\)",\{0,1\}$/\1/p'
}

# The flags one subcommand's --help lists: _coilfit_flags PROG SUBCOMMAND
_coilfit_flags() {
    "$1" "$2" --help 2>/dev/null | grep -o -- '--[a-z][a-z0-9-]*' | sort -u
}

_coilfit() {
    local cur prev prog sub i parts_args=()
    cur=${COMP_WORDS[COMP_CWORD]}
    prev=${COMP_WORDS[COMP_CWORD-1]}
    prog=${COMP_WORDS[0]}
    COMPREPLY=()

    # The subcommand is the first word that is not a flag; --parts PATH is passed on.
    sub=
    for ((i = 1; i < COMP_CWORD; i++)); do
        case ${COMP_WORDS[i]} in
            --parts) parts_args=(--parts "${COMP_WORDS[i+1]}") ;;
            --parts=*) parts_args=("${COMP_WORDS[i]}") ;;
        esac
        if [[ -z $sub && ${COMP_WORDS[i]} != -* ]]; then
            sub=${COMP_WORDS[i]}
        fi
    done

    if [[ -z $sub ]]; then
        if [[ $cur == -* ]]; then
            mapfile -t COMPREPLY < <(compgen -W '--help --version' -- "$cur")
        else
            mapfile -t COMPREPLY < <(compgen -W 'size pick yield board parts' -- "$cur")
        fi
        return 0
    fi

    local kind=
    case $prev in
        --transistor) kind=transistor ;;
        --diode) kind=diode ;;
        --zener) kind=zener ;;
        --tvs) kind=tvs ;;
        --coil-preset) kind=coil ;;
        --pin-preset) kind=pin ;;
        --relay) kind=relay ;;
        --format) mapfile -t COMPREPLY < <(compgen -W 'text json' -- "$cur"); return 0 ;;
        --clamp) mapfile -t COMPREPLY < <(compgen -W 'diode diode_zener diode_resistor diode_tvs none' -- "$cur"); return 0 ;;
        --series | --gate-series) mapfile -t COMPREPLY < <(compgen -W 'E3 E6 E12 E24 E48 E96 E192' -- "$cur"); return 0 ;;
        --choose) mapfile -t COMPREPLY < <(compgen -W 'largest centred' -- "$cur"); return 0 ;;
        --load-kind) mapfile -t COMPREPLY < <(compgen -W 'resistive inductive motor lamp capacitive solenoid transformer' -- "$cur"); return 0 ;;
        --load-type) mapfile -t COMPREPLY < <(compgen -W 'ac dc' -- "$cur"); return 0 ;;
        --distribution) mapfile -t COMPREPLY < <(compgen -W 'uniform normal' -- "$cur"); return 0 ;;
        --conditions) mapfile -t COMPREPLY < <(compgen -W 'worst sampled' -- "$cur"); return 0 ;;
        --parts) mapfile -t COMPREPLY < <(compgen -f -- "$cur"); return 0 ;;
        --output | -o | --netlist | --plot) mapfile -t COMPREPLY < <(compgen -f -- "$cur"); return 0 ;;
    esac
    if [[ -n $kind ]]; then
        mapfile -t COMPREPLY < <(compgen -W "$(_coilfit_ids "$prog" "$kind" "${parts_args[@]}")" -- "$cur")
        return 0
    fi

    if [[ $cur == -* ]]; then
        mapfile -t COMPREPLY < <(compgen -W "$(_coilfit_flags "$prog" "$sub")" -- "$cur")
        return 0
    fi
    if [[ $sub == parts ]]; then
        mapfile -t COMPREPLY < <(compgen -W 'npn darlington nmos array transistor diode rectifier fast signal schottky zener tvs coil pin' -- "$cur")
        return 0
    fi
    # SPEC or BOARD: a JSON file (or - for standard input).
    mapfile -t COMPREPLY < <(compgen -f -X '!*.json' -- "$cur"; compgen -d -- "$cur")
    return 0
}

complete -F _coilfit -o filenames coilfit
