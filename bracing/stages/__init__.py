"""The stages of `bracing.evaluate.evaluate`, one module each, in the order they run:

1. `arrays`: reading the walls into arrays (`Walls`);
2. `loads` and `wind`: load combinations, the lateral load kinds (`KINDS`), the wind;
3. `alone`: the checks of walls on their own;
4. `brace_set`, `brace_loads`, `braced`: the braced walls' layouts and capacities, the loads on
   them and each brace's reaction, every element's check;
5. `search`, `limits`: the limit-speed searches (working limits, one brace missing, fresh
   mortar, stand-down gusts) and the maximum heights;
6. `findings`: the flags, each a rule object;
7. `checkset`, `records`: the result objects (`bracing.results`).

`passes.evaluate_arrays` runs stages 1 to 5 over every wall at once and leaves their arrays in an
`evaluation.Evaluation`; `records.Results` turns those into the per-wall results.
"""
