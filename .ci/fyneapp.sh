# Sourced by .ci/dist.sh and .ci/dist-check.sh from the repository root.
#
# fyneapp KEY prints the value of KEY in FyneApp.toml's [Details] table, without
# quotes: Name, ID, Version, Build or Icon. FyneApp.toml is the one place that
# names Stave's version, application id and icon for the packages.
fyneapp() {
	local value
	value=$(awk -v key="$1" '
		/^[[:space:]]*\[/ { details = ($0 ~ /^[[:space:]]*\[Details\][[:space:]]*$/); next }
		details && $0 ~ "^[[:space:]]*" key "[[:space:]]*=" {
			sub(/^[^=]*=[[:space:]]*/, ""); sub(/[[:space:]]*$/, ""); gsub(/^"|"$/, "")
			print; exit
		}' FyneApp.toml)
	if [ -z "$value" ]; then
		echo "FyneApp.toml: [Details] has no $1; add it (see the fyne tool's metadata format)" >&2
		return 1
	fi
	printf '%s\n' "$value"
}

# windows_version prints the four numbers Windows wants in a program's version:
# FyneApp.toml's Version padded to three, then its Build.
windows_version() {
	local version build
	version=$(fyneapp Version)
	build=$(fyneapp Build)
	while [ "$(tr -cd . <<<"$version" | wc -c)" -lt 2 ]; do version+=.0; done
	printf '%s.%s\n' "$version" "$build"
}
