# Correcting measured patterns: sourced by examples/demo.sh (uses $mudepth, $out and step).
# The Tarnwick Institute, its samples and every pattern file here are invented: the files are
# synthetic, generated first by examples/make_patterns.py into $out/patterns.

python3 examples/make_patterns.py "$out/patterns"
rm -rf "$out/corrected"

step "TW-118 (invented CoAl2O4 pigment, packing 0.5) in a 0.5 mm capillary, Mo tube: one pattern corrected" \
    correct "$out/patterns/tw118_capillary.xye" --geometry cylinder --formula CoAl2O4 --density 4.4 --packing 0.5 \
    --source Mo --diameter 0.5 --output-dir "$out/corrected"

step "The same scan with its 10 µm borosilicate wall, the empty capillary subtracted (Paalman & Pings)" \
    correct "$out/patterns/tw118_capillary.xye" --geometry cylinder --formula CoAl2O4 --density 4.4 --packing 0.5 \
    --source Mo --diameter 0.5 --container-material borosilicate-3.3 --wall 10um \
    --empty "$out/patterns/tw118_empty_capillary.xye" --output-dir "$out/corrected/with_empty"

step "TW-205 in-situ heating series (12 invented files, semicolons and decimal commas), a 10 µm layer on a zero-background plate in reflection, Cu tube, normalised to the strongest point" \
    correct "$out"/patterns/tw205_insitu_*.csv --geometry reflection --formula Fe3O4 --density 5.17 --packing 0.55 \
    --source Cu --thickness 10um --normalize max --output-dir "$out/corrected/insitu"

step "TW-063 as pdCIF (2θ range as start/increment/count) in transmission, beam normal, Ag tube" \
    correct "$out/patterns/tw063_transmission.cif" --geometry transmission-normal --formula C14H12N2O3 \
    --density 1.38 --packing 0.6 --source Ag --thickness 1mm --output-dir "$out/corrected"

echo
echo "== The head of a corrected file"
head -n 16 "$out/corrected/tw118_capillary.corrected.xye"
echo "Corrected files: $out/corrected/"
