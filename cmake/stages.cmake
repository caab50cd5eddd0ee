# The stages of the data flow, in order: each stage is a folder under src/
# and include/dovetailor/, and a static library dovetailor_<stage>. A stage
# may use only the stages before it, and only those it names here (directly
# or through them). cmake/check_stages.cmake enforces both on every #include;
# the build runs it as a test and CI runs it before building.
#
#   job file -> job -> geometry -> plan -> report / gcode / drawing -> render
#   program  -> rs274 (interpreter) -> check (simulation) -> report
set(DOVETAILOR_STAGES base job geometry input shop plan rs274 check report gcode drawing render cli)

set(DOVETAILOR_STAGE_USES_base "")
set(DOVETAILOR_STAGE_USES_job base)
set(DOVETAILOR_STAGE_USES_geometry job)
set(DOVETAILOR_STAGE_USES_input geometry)
set(DOVETAILOR_STAGE_USES_shop input)
set(DOVETAILOR_STAGE_USES_plan shop)
set(DOVETAILOR_STAGE_USES_rs274 base)
set(DOVETAILOR_STAGE_USES_check plan rs274)
set(DOVETAILOR_STAGE_USES_report check)
set(DOVETAILOR_STAGE_USES_gcode report)
set(DOVETAILOR_STAGE_USES_drawing report)
set(DOVETAILOR_STAGE_USES_render drawing)
set(DOVETAILOR_STAGE_USES_cli gcode render)

# Every stage a stage may use: those it names and, through them, theirs.
function(dovetailor_stage_reach stage out_var)
  set(reach "")
  set(todo ${DOVETAILOR_STAGE_USES_${stage}})
  while(todo)
    list(POP_FRONT todo next)
    if(NOT next IN_LIST reach)
      list(APPEND reach ${next})
      list(APPEND todo ${DOVETAILOR_STAGE_USES_${next}})
    endif()
  endwhile()
  set(${out_var} ${reach} PARENT_SCOPE)
endfunction()
